import { describe, expect, test } from 'vitest';
import { labelModel } from './labelModel.ts';
import { labelText } from './text.ts';
import { LABEL_PRESETS } from './options.ts';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { demoReport, heldReport, hostileCatalog, hostileReport, HOSTILE_PATIENT, printOptions } from '../../../test/support/printFixtures.ts';

// Expected amounts come from the stock labels (field guide §0, §6.1) and the order, not from the
// engine: lipid 20% = 20 g oil/100 mL; potassium phosphates 3 mmol P + 4.4 mEq K per mL.
// Label contents and sequence: field guide §8.1 (ASPEN 2004 templates, ASPEN 2014 consensus).
// Beyond use: USP <797> (2008) 30 h at 20–25 °C, 9 days at 2–8 °C; ASPEN 2014 then 24 h at 25 °C.
// Filters: ASPEN 2014, 1.2 µm for 3-in-1, 0.22 µm for 2-in-1.

const text = (key: string, over = {}) => labelText(labelModel(demoReport(key), printOptions(over)));

describe('bag label of the adult peripheral 3-in-1 demo', () => {
  const t = text('adult-peripheral');

  test('patient, second identifier, location and dosing weight', () => {
    expect(t).toContain('Patient: Ada Quillfeather (fictional)');
    expect(t).toContain('ID: MRN-448210');
    expect(t).toContain('Location: Ward 5 East, bed 12');
    expect(t).toContain('Dosing weight: 68 kg (Adult)');
  });

  test('ingredients in label sequence with amounts per day; lipid in grams; phosphate in mmol; no water', () => {
    const rows = t.split('\n').filter((l) => l.includes('/day'));
    expect(rows).toEqual([
      'Amino acids | 80 g/day',
      'Dextrose | 150 g/day',
      'Lipid emulsion (soybean oil) | 50 g/day | ordered as 250 mL/day',
      'Sodium chloride | 60 mEq/day',
      'Potassium chloride | 40 mEq/day',
      'Potassium phosphates | 15 mmol/day | as phosphate, with 22 mEq/day K',
      'Magnesium sulfate | 8 mEq/day',
      'Calcium gluconate | 9.3 mEq/day',
      'Multiple vitamins, adult | 10 mL/day',
      'Trace elements, adult | 1 mL/day',
    ]);
    expect(t).not.toMatch(/water/i);
  });

  test('route within the peripheral limit, volume, rate, duration', () => {
    expect(t).toMatch(/^Route: Peripheral vein or central line — .*within the peripheral limit of 900 mOsm\/L/m);
    expect(t).toContain('Total volume: 2000 mL');
    expect(t).toContain('Rate: 83.33 mL/h'); // 2000 mL ÷ 24 h
    expect(t).toContain('Infuse over: 24 h');
  });

  test('compounded time, both beyond-use dates, storage, the 1.2 µm filter and the cautions', () => {
    expect(t).toContain('Compounded: 02 Dec 2026 14:30');
    expect(t).toContain('Use by 03 Dec 2026 20:30 if kept at room temperature 20–25 °C (30 h)');
    expect(t).toContain('Use by 11 Dec 2026 14:30 if kept refrigerated 2–8 °C (9 days), then up to 24 h at room temperature 20–25 °C');
    expect(t).toContain('Keep refrigerated at 2–8 °C');
    expect(t).toContain('Use a 1.2 µm in-line filter (3-in-1: contains lipid).');
    expect(t).toContain('Do not use if precipitate or separation is seen');
    expect(t).toContain('High-alert medication');
    expect(t).toContain('Barcode: Code 128 MPH-2026-0412');
    expect(t).toContain('Pharmacist verified (initials): ____');
  });
});

describe('route wording', () => {
  test('a bag over the peripheral limit says CENTRAL LINE ONLY, prominently', () => {
    const m = labelModel(demoReport('adult-central'), printOptions());
    expect(m.route).toMatchObject({ text: 'CENTRAL LINE ONLY', emphatic: true });
    expect(m.route.detail).toMatch(/over the peripheral limit of 900 mOsm\/L/);
    expect(labelText(m)).toContain('Use a 0.22 µm in-line filter (2-in-1: no lipid).');
  });

  test('a central bag under the limit says central line; a held bag carries a hold banner', () => {
    expect(labelModel(demoReport('preterm-neonate'), printOptions()).route).toMatchObject({ text: 'Central line', emphatic: false });
    const held = labelModel(heldReport(), printOptions());
    expect(held.hold).toMatch(/^ON HOLD/);
    expect(held.route.text).toBe('CENTRAL LINE ONLY');
  });
});

describe('bag label of the preterm neonate demo', () => {
  test('amounts per kg per day and per day (1.1 kg), with the sodium the glycerophosphate brings', () => {
    const rows = text('preterm-neonate').split('\n').filter((l) => l.includes('/kg/day'));
    expect(rows).toEqual([
      'Amino acids | 3.5 g/kg/day | 3.85 g/day',
      'Dextrose | 12 g/kg/day | 13.2 g/day',
      // Sodium glycerophosphate: 1 mmol P + 2 mmol Na per mL → 1.5 mmol/kg of P brings 3 mEq/kg of Na.
      'Sodium glycerophosphate | 1.5 mmol/kg/day | 1.65 mmol/day | as organic phosphate, with 3 mEq/kg/day Na',
      'Potassium acetate | 2 mEq/kg/day | 2.2 mEq/day',
      'Calcium gluconate | 2 mmol/kg/day | 2.2 mmol/day',
    ]);
  });
});

describe('options', () => {
  test('the label size, the compact layout for 4 × 4 in, and dates in the pharmacy’s time zone', () => {
    const m = labelModel(demoReport('adult-central'), printOptions({ labelSize: LABEL_PRESETS[1] ?? LABEL_PRESETS[0]!, timeZone: 'America/New_York' }));
    expect(m.size.id).toBe('4x4');
    expect(m.compact).toBe(true);
    expect(m.fitWarning).toBeNull();
    // 14:30 UTC is 09:30 in New York in December (UTC−5).
    expect(m.compounded).toBe('02 Dec 2026 09:30');
    expect(m.beyondUse[0]?.until).toBe('03 Dec 2026 15:30');
  });

  test('a policy without beyond-use times asks for a handwritten date instead of inventing one', () => {
    const m = labelModel(demoReport('adult-central'), printOptions({ policy: { ...DEFAULT_POLICY, beyondUse: null } }));
    expect(m.beyondUse).toEqual([]);
    expect(m.beyondUseProblem).toMatch(/the pharmacist writes it by hand/);
  });

  test('an invalid compounding time is said in words; nothing throws', () => {
    const m = labelModel(demoReport('adult-central'), printOptions({ compoundedAt: new Date('x') }));
    expect(m.compounded).toBe('(no valid date and time)');
    expect(m.beyondUseProblem).toBe('compoundedAt: is not a valid date and time');
  });
});

test('an order too long for its label is flagged, with the advice to use a larger one', () => {
  const r = demoReport('adult-central');
  const many = { ...r, patient: { ...r.patient, ageGroup: 'child' as const }, lines: [...r.lines, ...r.lines.filter((l) => l.role === 'electrolyte').map((l, i) => ({ ...l, index: 20 + i }))] };
  const m = labelModel(many, printOptions({ labelSize: LABEL_PRESETS[1] ?? LABEL_PRESETS[0]! }));
  expect(m.fitWarning).toBe(`This label may not fit on one 4 × 4 in label (${m.ingredients.length} ingredients): print it on a larger label.`);
  expect(labelModel(many, printOptions()).fitWarning).toBeNull();
});

test('an order id Code 128 cannot carry gets no barcode, and says why', () => {
  const m = labelModel({ ...demoReport('adult-central'), order: 'MPH-2026-0413-ü' }, printOptions());
  expect(m.barcode).toBeNull();
  expect(m.barcodeProblem).toMatch(/^order: cannot be drawn as Code 128/);
});

test('names with markup and ampersands are kept as text in the model', () => {
  const m = labelModel(hostileReport(), printOptions({ catalog: hostileCatalog() }));
  expect(m.patient.name).toBe(HOSTILE_PATIENT);
  expect(m.ingredients.map((i) => i.name)).toContain('Zinc <script>alert</script> & copper');
  expect(m.ingredients.find((i) => i.name.startsWith('Zinc'))?.group).toBe('trace-elements');
});
