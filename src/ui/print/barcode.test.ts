import { describe, expect, test } from 'vitest';
import { orderBarcode, type Barcode } from './barcode.ts';

/** The bar/space modules of a drawn barcode, as a string of 1 (bar) and 0 (space). */
function modules(b: Barcode): string {
  const width = Number(b.viewBox.split(' ')[2]);
  const cells: string[] = Array.from({ length: width }, () => '0');
  for (const p of b.paths) {
    const w = Number(p.strokeWidth);
    for (const m of p.d.matchAll(/M([\d.]+) /g)) {
      const left = Number(m[1]) - w / 2;
      for (let x = left; x < left + w; x += 1) cells[x] = '1';
    }
  }
  return cells.join('');
}

describe('orderBarcode', () => {
  test('draws Code 128 exactly as the symbol table gives it ("ABC" in code set B)', () => {
    // ISO/IEC 15417 Code 128 symbol patterns (as tabulated in the Wikipedia "Code 128" article):
    // Start B 11010010000; A (33) 10100011000; B (34) 10001011000; C (35) 10001000110;
    // check value (104 + 33·1 + 34·2 + 35·3) mod 103 = 1 → 11001101100; Stop 1100011101011.
    const b = orderBarcode('ABC');
    expect(b.ok).toBe(true);
    if (!b.ok) return;
    expect(modules(b.value)).toBe('11010010000' + '10100011000' + '10001011000' + '10001000110' + '11001101100' + '1100011101011');
    expect(b.value.symbology).toBe('Code 128');
  });

  test('a demo order id: 14 symbols of 11 modules plus the 13-module stop (digit pairs in code set C)', () => {
    // Start B, M P H -, C-shift, 20 26, B-shift, -, C-shift, 04 13, check: 14 symbols (ISO/IEC 15417).
    const b = orderBarcode('MPH-2026-0413');
    expect(b.ok && modules(b.value).length).toBe(14 * 11 + 13);
  });

  test('an id Code 128 cannot carry is a problem with its path, never a broken drawing', () => {
    for (const text of ['', 'MPH–2026', 'x'.repeat(81)]) {
      const b = orderBarcode(text);
      expect(b.ok).toBe(false);
      expect(b.ok ? '' : b.problems[0]?.path).toBe('order');
    }
  });
});
