// @vitest-environment jsdom
import { describe, expect, test } from 'vitest';
import { renderLabelHtml, renderSheetHtml, escapeHtml } from './html.tsx';
import { sheetModel } from './sheetModel.ts';
import { labelModel } from './labelModel.ts';
import { parseLabelSize } from './options.ts';
import { demoReport, hostileCatalog, hostileReport, HOSTILE_PATIENT, HOSTILE_PRODUCT, printOptions } from '../../../test/support/printFixtures.ts';

function parse(html: string): Document {
  return new DOMParser().parseFromString(html, 'text/html');
}

function selfContained(html: string) {
  expect(html.startsWith('<!doctype html>')).toBe(true);
  expect(html).toMatch(/<style>[\s\S]*\.pr-sheet[\s\S]*<\/style>/);
  expect(html).not.toMatch(/<script|<link|\ssrc=|\shref=|@import|url\(/i);
}

describe('renderSheetHtml', () => {
  test('one self-contained document: styles inline, nothing fetched, the named A4 or Letter page', () => {
    const a4 = renderSheetHtml(sheetModel(demoReport('adult-central'), printOptions()));
    selfContained(a4);
    expect(a4).toContain('@page pr-a4');
    expect(parse(a4).querySelector('article.pr-sheet.pr-paper-a4')).not.toBeNull();
    const letter = renderSheetHtml(sheetModel(demoReport('adult-central'), printOptions({ paper: 'letter' })));
    expect(parse(letter).querySelector('article.pr-paper-letter')).not.toBeNull();
    expect(parse(letter).title).toBe('PN verification sheet — MPH-2026-0413 (US Letter)');
  });

  test('patient and product names with <script> and & print literally, as text', () => {
    const html = renderSheetHtml(sheetModel(hostileReport(), printOptions({ catalog: hostileCatalog() })));
    selfContained(html);
    expect(html).toContain('&lt;script&gt;alert(&quot;pt&quot;)&lt;/script&gt; Smith &amp; Jones');
    const doc = parse(html);
    expect(doc.querySelectorAll('script, b, i')).toHaveLength(0);
    const body = doc.body.textContent ?? '';
    expect(body).toContain(HOSTILE_PATIENT);
    expect(body).toContain(HOSTILE_PRODUCT);
    expect(body).toContain('MRN-<b>1</b>&2');
    expect(body).toContain('Ward <i>7</i> & annex');
    expect(doc.title).toBe('PN verification sheet — MPH-2026-<&> (A4)');
  });
});

describe('renderLabelHtml', () => {
  test('the label page at its size with the barcode as inline SVG', () => {
    const html = renderLabelHtml(labelModel(demoReport('adult-central'), printOptions()));
    selfContained(html);
    const doc = parse(html);
    expect(doc.querySelector('article.pr-label.pr-size-4x6')).not.toBeNull();
    const svg = doc.querySelector('svg.pr-barcode');
    expect(svg?.getAttribute('aria-label')).toBe('Code 128 barcode of MPH-2026-0413');
    expect(svg?.querySelectorAll('path').length).toBeGreaterThan(0);
    expect(doc.querySelector('.pr-l-route-only')?.textContent).toContain('CENTRAL LINE ONLY');
  });

  test('a custom size brings its page rule into the document', () => {
    const size = parseLabelSize('100x150mm');
    if (!size.ok) throw new Error('size');
    const html = renderLabelHtml(labelModel(demoReport('preterm-neonate'), printOptions({ labelSize: size.value })));
    expect(html).toContain('@page pr-label-custom { size: 100mm 150mm; margin: 0; }');
    expect(parse(html).querySelector('article.pr-size-custom')).not.toBeNull();
  });

  test('hostile names are text on the label too', () => {
    const doc = parse(renderLabelHtml(labelModel(hostileReport(), printOptions({ catalog: hostileCatalog() }))));
    expect(doc.querySelectorAll('script, b, i')).toHaveLength(0);
    expect(doc.querySelector('.pr-l-name')?.textContent).toBe(HOSTILE_PATIENT);
    expect(doc.body.textContent).toContain('Zinc <script>alert</script> & copper');
    // "MPH-2026-<&>" is printable ASCII, so Code 128 carries it; the caption shows it as text.
    expect(doc.querySelector('svg.pr-barcode')).not.toBeNull();
    expect(doc.querySelector('.pr-l-code figcaption')?.textContent).toBe('Order MPH-2026-<&>');
  });
});

test('escapeHtml escapes the five markup characters', () => {
  expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
});
