import type { SheetModel } from './model.ts';

/** Text as a CSS string literal: every character outside a safe set is a hex escape (so no `</style>` or quote can end it). */
export function cssString(text: string): string {
  let out = '';
  for (const ch of text) out += /[A-Za-z0-9 .,:;_-]/.test(ch) ? ch : `\\${(ch.codePointAt(0) ?? 0).toString(16)} `;
  return `"${out}"`;
}

/**
 * The page rule that prints the order id and patient id at the foot of every sheet page, so a
 * loose page still says which bag it belongs to (the page numbers come from print.css).
 */
export function sheetPageCss(m: SheetModel): string {
  const patient = m.order.find((f) => f.label === 'Patient ID')?.value ?? '';
  const foot = `Order ${m.orderId} · patient ID ${patient} · ${m.title}`;
  return `@page pr-${m.paper} { @bottom-left { content: ${cssString(foot)}; font: 7pt 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif; color: #4f5b66; } }\n`;
}
