import { renderToStaticMarkup } from 'react-dom/server';
import css from './print.css?raw';
import { LabelView } from './LabelView.tsx';
import { SheetView } from './SheetView.tsx';
import type { LabelModel, SheetModel } from './model.ts';
import { customLabelCss, labelSizeText, PAPER_TEXT } from './options.ts';
import { sheetPageCss } from './pageCss.ts';

/** Text escaped for HTML (element content and quoted attributes). */
export function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

function documentHtml(title: string, body: string, extraCss: string): string {
  return [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${escapeHtml(title)}</title>`,
    `<style>\n${css}\n${extraCss}</style>`,
    '</head>',
    `<body class="pr-doc">${body}</body>`,
    '</html>',
    '',
  ].join('\n');
}

/**
 * The verification sheet as one self-contained HTML document (styles inline, nothing fetched), for
 * printing headless; every text is escaped by the renderer.
 */
export function renderSheetHtml(model: SheetModel): string {
  return documentHtml(`${model.title} — ${model.orderId} (${PAPER_TEXT[model.paper]})`, renderToStaticMarkup(<SheetView model={model} />), sheetPageCss(model));
}

/** The bag label as one self-contained HTML document, its page the label's size; the barcode is inline SVG. */
export function renderLabelHtml(model: LabelModel): string {
  return documentHtml(`Bag label — ${model.orderId} (${labelSizeText(model.size)})`, renderToStaticMarkup(<LabelView model={model} />), customLabelCss(model.size));
}
