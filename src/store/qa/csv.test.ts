import { describe, expect, it } from 'vitest';
import type { QaEntry } from '../types.ts';
import { csvField, csvRecords, csvText, qaCsv } from './csv.ts';

describe('CSV quoting', () => {
  it('follows RFC 4180: quote fields with commas, quotes or line breaks, double the quotes, CRLF records', () => {
    // RFC 4180 §2 examples: "aaa","b""bb","ccc" and a field with a line break inside quotes.
    expect(csvField('aaa')).toBe('aaa');
    expect(csvField('b"bb')).toBe('"b""bb"');
    expect(csvField('b,bb')).toBe('"b,bb"');
    expect(csvField('b\r\nbb')).toBe('"b\r\nbb"');
    expect(csvRecords([['aaa', 'bbb'], ['zzz', 'yyy']])).toBe('aaa,bbb\r\nzzz,yyy\r\n');
  });

  it('neutralises text a spreadsheet would run as a formula (OWASP CSV Injection)', () => {
    expect(csvText('=HYPERLINK("x")')).toBe('"\'=HYPERLINK(""x"")"');
    expect(csvText('+1')).toBe("'+1");
    expect(csvText('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvText('freezing point, lab 2')).toBe('"freezing point, lab 2"');
  });
});

describe('the QA log as CSV', () => {
  it('writes one row per measurement with every calculated figure and its difference', () => {
    const e: QaEntry = {
      id: 'q1', orderKey: 'k', orderId: 'MPH-2026-0412', version: 2, measured: '950', method: 'freezing-point',
      instrument: 'Osmometer 2, "cal. 2026-11-30"', measuredOn: '2026-12-01', recordedAt: '2026-12-01T09:00:00.000Z', recordedBy: 'AB',
      ageBand: 'adult', system: '3-in-1',
      calculated: [
        { key: 'particle', label: 'Particle count', value: 874.5, unit: 'mOsm/L' },
        { key: 'labelSum', label: 'Label sum', value: 897, unit: 'mOsm/L' },
        { key: 'predicted:osmotic-coefficient', label: 'Predicted: osmotic coefficients', value: 930.2, unit: 'mOsm/kg' },
      ],
    };
    const lines = qaCsv([e]).split('\r\n');
    expect(lines[0]).toBe('measured_on,order_id,version,age_band,system,measured_mosm_per_kg,method,instrument,particle_calculated,labelSum_calculated,predicted:osmotic-coefficient_calculated,particle_difference,labelSum_difference,predicted:osmotic-coefficient_difference,recorded_at,recorded_by');
    // differences: 950 − 874.5 = 75.5; 950 − 897 = 53; 950 − 930.2 = 19.8
    expect(lines[1]).toBe('2026-12-01,MPH-2026-0412,2,adult,3-in-1,950,freezing-point,"Osmometer 2, ""cal. 2026-11-30""",874.5,897,930.2,75.5,53,19.8,2026-12-01T09:00:00.000Z,AB');
    expect(lines[2]).toBe('');
    expect(lines).toHaveLength(3);
  });
});
