import { describe, expect, test } from 'vitest';
import { sheetModel } from './sheetModel.ts';
import { sheetText } from './text.ts';
import { demoReport, heldReport, printOptions } from '../../../test/support/printFixtures.ts';

// Line figures are checked against the stock labels (field guide §0, §6.1, §9.4), not the engine:
// dextrose 70% = 0.7 g/mL and 3532 mOsm/L; amino acids 10% = 0.1 g/mL; lipid 20% 260 mOsm/L;
// potassium phosphates 3 mmol P/mL and 7.4 mOsm/mL; calcium gluconate 10% 0.465 mEq/mL, 680 mOsm/L.
// Peripheral limit 900 mOsm/L: ASPEN 2014 (Boullata et al.).

describe('verification sheet of the adult peripheral demo', () => {
  const t = sheetText(sheetModel(demoReport('adult-peripheral'), printOptions()));

  test('institution, order, date and time, patient, weight, age group, route, volume, hours, rate', () => {
    for (const s of ['Marren Point Hospital — PN verification sheet (A4)', 'Order MPH-2026-0412 — printed 02 Dec 2026 13:05',
      'Patient: Ada Quillfeather (fictional)', 'Patient ID: MRN-448210', 'Location: Ward 5 East, bed 12', 'Dosing weight: 68 kg',
      'Age group: Adult', 'Route ordered: Peripheral vein', 'Final volume: 2000 mL', 'Infusion time: 24 h', 'Rate: 83.33 mL/h']) {
      expect(t).toContain(s);
    }
  });

  test('every line: stock, strength, amount per day, volume to add, mOsm (label arithmetic)', () => {
    expect(t).toContain('2 | Dextrose 70% injection | 70 g/100 mL (hydrous) | 150 g/day | 214.29 mL | 756.9 mOsm |'); // 150 ÷ 0.7; × 3.532
    expect(t).toContain('1 | Amino acids 10% injection (without added electrolytes) | 10 g/100 mL | 80 g/day | 800.00 mL |');
    expect(t).toContain('| 250 mL/day | 250.00 mL | 65.0 mOsm |'); // 250 × 0.26 (field guide §9.4 D2)
    expect(t).toContain('| 15 mmol/day phosphate | 5.00 mL | 37.0 mOsm |'); // 15 ÷ 3; 5 × 7.4 (§9.4 D1)
    expect(t).toContain('| 9.3 mEq/day Ca | 20.00 mL | 13.6 mOsm |'); // 9.3 ÷ 0.465; 20 × 0.68 (§9.4 D2)
    expect(t).toContain('11 | Sterile water for injection | — | to volume |');
    expect(t).toContain('# | Stock | Stock strength | Ordered per day | Volume to add | mOsm | Checked'); // adults: no per-kg column
  });

  test('both osmolarities, the reported one against the limit, totals and the verdict', () => {
    const r = demoReport('adult-peripheral');
    expect(t).toContain(`Particle count (ideal, USP <785>): ${r.osmolarity.particle.toFixed(1)} mOsm/L`);
    expect(t).toContain(`Label sum (labelled stock osmolarities): ${r.osmolarity.labelSum.toFixed(1)} mOsm/L`);
    expect(t).toContain('Peripheral limit (adult): 900 mOsm/L');
    expect(t).toMatch(/Reported \d+\.\d mOsm\/L is within the peripheral limit of 900 mOsm\/L\./);
    expect(t).toContain('Dextrose: 7.50 % w/v'); // 150 g in 2000 mL
    expect(t).toContain('Amino acids: 4.00 % w/v'); // 80 g in 2000 mL
    expect(t).toContain('Lipid: 2.50 % w/v'); // 50 g in 2000 mL
    expect(t).toContain('Glucose infusion rate (GIR): 1.53 mg/kg/min'); // 150 000 mg ÷ 68 kg ÷ 1440 min = 1.532
    expect(t).toContain('Amino acids: 80 g/day · 1.18 g/kg/day'); // 80 ÷ 68
    expect(t).toContain('From lipid: 500.0 kcal/day'); // 250 mL × 2.0 kcal/mL (20% ILE label, §0 D19)
    expect(t).toContain('Potassium | 62 mmol/day |'); // 40 mEq KCl + 5 mL × 4.4 mEq K
    // Every finding of the report, with its severity word, value, limit and source.
    for (const f of r.findings) {
      expect(t).toContain(`${{ block: 'Hold', warn: 'Review', info: 'Note' }[f.severity]} ${f.code}`);
      expect(t).toContain(`source: ${f.source}`);
    }
    expect(t).toMatch(/Note calcium-phosphate: .* \| value 17\.4 mmol²\/L² \| limit 100 mmol²\/L² \| source: Knight/); // 2.32 × 7.50 mmol/L (Knight 1983 screen)
    expect(t).toContain(`Verdict: ${r.verdict === 'pass' ? 'Pass — No finding holds this bag.' : 'Review'}`);
  });

  test('label details for the checker, sign-off lines and the cautions', () => {
    expect(t).toContain('Route on the label: Peripheral vein or central line');
    expect(t).toContain('Use by, if kept at room temperature 20–25 °C: 03 Dec 2026 20:30 (30 h)');
    expect(t).toContain('In-line filter: Use a 1.2 µm in-line filter (3-in-1: contains lipid).');
    expect(t).toMatch(/Sources: USP <797> \(2008\)/);
    expect(t).toContain('Prepared by: ____ Date and time: ____');
    expect(t).toContain('Checked by: ____ Date and time: ____');
    expect(t).toContain('local policy and the verifying pharmacist decide');
    expect(t).toContain('PN is a high-alert medication');
    expect(t).toContain('a checking aid');
    expect(t).not.toContain('Suggested mixing sequence');
  });
});

describe('findings and verdict of a held bag (dextrose 250 g peripherally)', () => {
  test('each finding with severity, value, limit and source; verdict Hold', () => {
    const r = heldReport();
    const f = r.findings.find((x) => x.code === 'osmolarity-peripheral');
    const t = sheetText(sheetModel(r, printOptions()));
    expect(f?.value).toBeGreaterThan(900);
    expect(t).toMatch(new RegExp(`Hold osmolarity-peripheral: .* \\| value ${f?.value} mOsm/L \\| limit 900 mOsm/L \\| source: ASPEN 2014 \\(Boullata et al\\., JPEN 38:334\\)`));
    expect(t).toContain('Verdict: Hold — Do not compound as ordered.');
    expect(t).toContain('is over the peripheral limit of 900 mOsm/L: central line only.');
  });
});

describe('preterm neonate demo', () => {
  test('lines per day and per kg per day for a 1.1 kg infant', () => {
    const t = sheetText(sheetModel(demoReport('preterm-neonate'), printOptions({ paper: 'letter' })));
    expect(t).toContain('(US Letter)');
    expect(t).toContain('# | Stock | Stock strength | Ordered per day | Per kg per day | Volume to add | mOsm | Checked');
    expect(t).toContain('| 3.85 g/day | 3.5 g/kg/day | 38.50 mL |'); // 3.5 × 1.1 g; ÷ 0.1 g/mL
    expect(t).toContain('| 13.2 g/day | 12 g/kg/day | 26.40 mL |'); // 12 × 1.1 g of dextrose 50% (0.5 g/mL)
    expect(t).toContain('| 1.65 mmol/day glycerophosphate | 1.5 mmol/kg/day | 1.65 mL |'); // 1 mmol P/mL
  });
});

describe('mixing sequence', () => {
  test('printed when given, with each step’s reason and source', () => {
    const t = sheetText(sheetModel(demoReport('adult-central'), printOptions({
      sequence: [
        { step: 1, lines: [{ index: 0, name: 'Amino acids 15% injection' }, { index: 1, name: 'Dextrose 70% injection' }], mixAfter: false, reason: 'Base solution first.', source: 'common practice' },
        { step: 2, lines: [{ index: 5, name: 'Potassium phosphates injection' }], mixAfter: true, reason: 'Phosphate early, well mixed before calcium.', source: 'ASPEN 2014' },
      ],
    })));
    expect(t).toContain('Suggested mixing sequence\n1. Amino acids 15% injection (line 1); Dextrose 70% injection (line 2). Base solution first. (source: common practice)');
    expect(t).toContain('2. Potassium phosphates injection (line 6). Mix well before the next step. Phosphate early, well mixed before calcium. (source: ASPEN 2014)');
    expect(t).toContain('The mixing sequence is a suggestion');
  });
});
