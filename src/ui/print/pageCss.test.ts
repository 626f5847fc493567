import { expect, test } from 'vitest';
import { cssString, sheetPageCss } from './pageCss.ts';
import { sheetModel } from './sheetModel.ts';
import { demoReport, hostileCatalog, hostileReport, printOptions } from '../../../test/support/printFixtures.ts';

test('CSS strings escape quotes, backslashes and markup', () => {
  expect(cssString('MPH-2026-0413')).toBe('"MPH-2026-0413"');
  expect(cssString('a"b\\c</style>')).toBe('"a\\22 b\\5c c\\3c \\2f style\\3e "');
});

test('every sheet page carries the order id and patient id at its foot', () => {
  expect(sheetPageCss(sheetModel(demoReport('adult-central'), printOptions()))).toBe(
    '@page pr-a4 { @bottom-left { content: "Order MPH-2026-0413 \\b7  patient ID MRN-301977 \\b7  PN verification sheet"; font: 7pt \'DejaVu Sans\', \'Liberation Sans\', Arial, sans-serif; color: #4f5b66; } }\n');
  const hostile = sheetPageCss(sheetModel(hostileReport(), printOptions({ catalog: hostileCatalog(), paper: 'letter' })));
  expect(hostile.startsWith('@page pr-letter {')).toBe(true);
  expect(hostile).not.toMatch(/[<>&]/);
});
