import { describe, expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { csvItems } from './csv.ts';
import { formatFileProblem, type InputItem } from './inputs.ts';
import { checkOrder } from '../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../defaults.ts';

const demo = (name: string): Record<string, unknown> => JSON.parse(readFileSync(new URL(`../../data/demo/${name}.json`, import.meta.url), 'utf8'));

async function items(text: string | Buffer, chunkBytes = 64 * 1024): Promise<InputItem[]> {
  const bytes = typeof text === 'string' ? Buffer.from(text, 'utf8') : text;
  const pieces: Buffer[] = [];
  for (let i = 0; i < bytes.length; i += chunkBytes) pieces.push(bytes.subarray(i, i + chunkBytes));
  const out: InputItem[] = [];
  for await (const item of csvItems('day.csv', Readable.from(pieces, { objectMode: false }))) out.push(item);
  return out;
}

const problems = (list: InputItem[]) => list.flatMap((i) => (i.kind === 'invalid' ? i.problems.map(formatFileProblem) : []));
const orders = (list: InputItem[]) => list.flatMap((i) => (i.kind === 'order' ? [i.order] : []));

const HEADER = 'order_id,patient_id,patient_name,location,weight_kg,age_group,route,volume_ml,hours,product,amount,unit,species,fill,note';

/**
 * The adult peripheral demo order (data/demo/adult-peripheral.json) written the way a spreadsheet
 * exports it: a byte-order mark, Windows line endings, quoted cells holding commas and quotes,
 * order columns on the first row only.
 */
const ADULT_PERIPHERAL_CSV = `\uFEFF${[
  HEADER,
  'MPH-2026-0412,MRN-448210,Ada Quillfeather (fictional),"Ward 5 East, bed 12",68,adult,peripheral,2000,24,amino-acids-10,80,g,,,',
  'MPH-2026-0412,,,,,,,,,dextrose-70,150,g,,,',
  'MPH-2026-0412,,,,,,,,,lipid-20,250,mL,,,"Add last; ""protect from light"""',
  'MPH-2026-0412,,,,,,,,,sodium-chloride-4,60,mEq,,,',
  'MPH-2026-0412,,,,,,,,,potassium-chloride-2,40,mEq,,,',
  'MPH-2026-0412,,,,,,,,,potassium-phosphates-3,15,mmol,phosphate,,',
  'MPH-2026-0412,,,,,,,,,magnesium-sulfate-50,8,mEq,,,',
  'MPH-2026-0412,,,,,,,,,calcium-gluconate-10,9.3,mEq,,,',
  'MPH-2026-0412,,,,,,,,,multivitamin-adult,10,mL,,,',
  'MPH-2026-0412,,,,,,,,,trace-elements-adult,1,mL,,,',
  'MPH-2026-0412,,,,,,,,,sterile-water,,,,TRUE,',
].join('\r\n')}\r\n`;

describe('csvItems', () => {
  test('a spreadsheet export (BOM, CRLF, quoted commas and quotes) reads as the same order as its JSON file', async () => {
    for (const chunk of [5, 64 * 1024]) {
      const found = await items(ADULT_PERIPHERAL_CSV, chunk);
      expect(problems(found)).toEqual([]);
      const [order] = orders(found);
      expect(order?.where).toBe('rows 2-12');
      const value = order?.value as { patient: { location: string }; lines: { note?: string }[] };
      expect(value.patient.location).toBe('Ward 5 East, bed 12');
      expect(value.lines[2]?.note).toBe('Add last; "protect from light"');
      // The oracle is the order's own JSON file (exchange format): the same report, figure for figure.
      const fromCsv = checkOrder(order?.value, DEFAULT_CATALOG, DEFAULT_POLICY);
      const fromJson = checkOrder(demo('adult-peripheral'), DEFAULT_CATALOG, DEFAULT_POLICY);
      expect(fromCsv.ok && fromJson.ok).toBe(true);
      if (fromCsv.ok && fromJson.ok) expect(fromCsv.value.report).toEqual(fromJson.value.report);
    }
  });

  test('order columns repeated on every row are fine; several orders follow each other; a problem in a line names its row', async () => {
    const text = [
      'order_id,patient_id,weight_kg,age_group,route,volume_ml,product,amount,unit,fill',
      'A,P1,70,adult,central,1000,dextrose-70,100,g,',
      'A,P1,70,adult,central,1000,sterile-water,,,true',
      'B,P2,3,term-neonate,central,300,amino-acids-10,3,g/kg,',
      'B,P2,3,term-neonate,central,300,dextrose-50,abc,g/kg,',
      'B,P2,3,term-neonate,central,300,sterile-water,,,true',
    ].join('\n');
    const [a, b] = orders(await items(text));
    expect(a?.value).toEqual({
      id: 'A', patient: { id: 'P1', weightKg: '70', ageGroup: 'adult' }, route: 'central', volumeMl: '1000',
      lines: [{ product: 'dextrose-70', amount: '100', unit: 'g' }, { product: 'sterile-water', fill: true }],
    });
    expect(b?.where).toBe('rows 4-6');
    expect(b?.whereOf?.('lines[1].amount')).toBe('row 5');
    expect(b?.whereOf?.('patient.weightKg')).toBe('rows 4-6');
    const r = checkOrder(b?.value, DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(r.ok ? [] : r.problems.map((p) => `${b?.whereOf?.(p.path)}: ${p.path}`)).toEqual(['row 5: lines[1].amount']);
  });

  test('a missing column is named, with the file, and no row is read', async () => {
    const text = 'order_id,patient_id,age_group,route,volume_ml,product,amount,unit\nA,P1,adult,central,1000,dextrose-70,100,g\n';
    const found = await items(text);
    expect(found).toHaveLength(1);
    expect(problems(found)).toEqual(['day.csv: (header): missing column "weight_kg"; an order CSV needs order_id, patient_id, weight_kg, age_group, route, volume_ml, product, amount, unit']);
  });

  test('unknown and doubled columns, and a file split by semicolons, are refused with the reason', async () => {
    expect(problems(await items(`${HEADER},volume\n`))).toEqual([expect.stringMatching(/^day\.csv: \(header\): unknown column "volume"; known columns are order_id, /)]);
    expect(problems(await items(`${HEADER},unit\n`))).toEqual(['day.csv: (header): column "unit" given twice']);
    expect(problems(await items(`${HEADER.replaceAll(',', ';')}\n`))[0]).toMatch(/^day\.csv: \(header\): missing columns "order_id", .* \(columns must be separated by commas\)/);
  });

  test('rows of one order that disagree, come back after another order, or have the wrong number of fields make it invalid', async () => {
    const text = [
      'order_id,patient_id,weight_kg,age_group,route,volume_ml,product,amount,unit',
      'A,P1,70,adult,central,1000,dextrose-70,100,g',
      'A,P1,70,adult,central,2000,amino-acids-10,50,g',
      'B,P2,70,adult,central,1000,dextrose-70,100,g',
      'A,P1,70,adult,central,1000,lipid-20,100,mL',
      'C,P3,70,adult,central,1000,dextrose-70,100,g,extra',
    ].join('\n');
    expect(problems(await items(text))).toEqual([
      'day.csv: row 3: volume_ml: "2000" differs from "1000" on row 2 of the same order',
      'day.csv: row 5: order_id: "A" already had rows 2-3: the rows of one order must be next to each other (sort the file by order_id); the earlier part was checked alone and its report is incomplete',
      'day.csv: row 6: (row): has 10 fields where the header has 9 (a comma inside a field needs "quotes")',
    ]);
  });

  test('an unclosed quote stops the file and says what was not checked; a stray quote inside a cell is kept as written', async () => {
    const head = 'order_id,patient_id,weight_kg,age_group,route,volume_ml,product,amount,unit,note';
    const found = await items(`${head}\nA,P1,70,adult,central,1000,dextrose-70,100,g,"open\nA,P1,70,adult,central,1000,lipid-20,100,mL,\n`);
    expect(orders(found)).toEqual([]);
    expect(problems(found)).toEqual([expect.stringMatching(/^day\.csv: row 3: \(file\): is not valid CSV \(Quote Not Closed: .*\); no order in it was checked\.$/)]);
    const late = problems(await items(`${head}\nA,P1,70,adult,central,1000,dextrose-70,100,g,\nA,P1,70,adult,central,1000,lipid-20,100,mL,\n${'B,P2,70,adult,central,1000,dextrose-70,100,g,\n'.repeat(5000)}C,"open\n`, 1024));
    expect(late).toEqual([expect.stringMatching(/; nothing after row \d+ was checked\. Order "B" \(rows 4-\d+\) was not checked\.$/)]);
    const stray = orders(await items(`${head}\nA,P1,70,adult,central,1000,dextrose-70,100,g,5" tubing\n`));
    expect((stray[0]?.value as { lines: { note: string }[] }).lines[0]?.note).toBe('5" tubing');
  });

  test('an empty file is a problem; a row without an order id is named', async () => {
    expect(problems(await items(''))).toEqual(['day.csv: (file): is empty: expected a header row (order_id, patient_id, weight_kg, age_group, route, volume_ml, product, amount, unit) and one row per order line']);
    const text = 'order_id,patient_id,weight_kg,age_group,route,volume_ml,product,amount,unit\n,P1,70,adult,central,1000,dextrose-70,100,g\n';
    expect(problems(await items(text))).toEqual(['day.csv: row 2: order_id: is empty: every row names the order it belongs to']);
  });
});
