// Field guide §9.4, derived examples D1 (adult central 2-in-1) and D2 (adult peripheral 3-in-1):
// the catalog is built from the guide's own factors (§0, §1.3), so each bag reproduces the
// guide's arithmetic, and the checks must produce the findings the guide derives.
import { describe, expect, it } from 'vitest';
import { parseCatalog, type Catalog } from '../src/core/catalog.ts';
import { DEFAULT_POLICY } from '../src/defaults.ts';
import { reportSchema } from '../src/core/report.ts';
import { evaluate, one, pick } from './helpers/orders.ts';

const guideCatalog = ((): Catalog => {
  const r = parseCatalog({
    format: 'osmocount-catalog', version: 1, id: 'field-guide-9-4', name: 'Field guide §9.4 factors',
    products: [
      // amino acids: the teaching factor 10 mOsm/g (D3), 4 kcal/g (D19); no electrolytes
      { id: 'amino-acids', name: 'Amino acids 10% injection', role: 'amino-acids', nutrient: { gramsPerMl: '0.1', mOsmPerGram: 10 }, mOsmPerMl: 1, kcalPerMl: '0.4' },
      // dextrose hydrous 5.046 mOsm/g (D1), label 3532 mOsm/L, 3.4 kcal/g
      { id: 'dextrose-70', name: 'Dextrose 70% injection', role: 'dextrose', nutrient: { gramsPerMl: '0.7', mOsmPerGram: '5.046', basis: 'hydrous' }, mOsmPerMl: '3.532', kcalPerMl: '2.38' },
      // lipid emulsion 20%: 1.3 mOsm/g oil = 0.26 mOsm/mL (D4), 2.0 kcal/mL (D19)
      { id: 'lipid-20', name: 'Lipid injectable emulsion 20%', role: 'lipid', nutrient: { gramsPerMl: '0.2', mOsmPerGram: '1.3' }, mOsmPerMl: '0.26', kcalPerMl: 2 },
      // Na or K as chloride or acetate: 2 mOsm/mEq (D5)
      { id: 'sodium-chloride-4', name: 'Sodium chloride 23.4% injection', role: 'electrolyte', perMl: { Na: 4, Cl: 4 }, mOsmPerMl: 8 },
      { id: 'sodium-acetate-2', name: 'Sodium acetate injection 2 mEq/mL', role: 'electrolyte', perMl: { Na: 2, acetate: 2 }, mOsmPerMl: 4 },
      { id: 'potassium-chloride-2', name: 'Potassium chloride injection 2 mEq/mL', role: 'electrolyte', perMl: { K: 2, Cl: 2 }, mOsmPerMl: 4 },
      // phosphates 7.0 and 7.4 mOsm/mL (D6, D7)
      { id: 'sodium-phosphates-3', name: 'Sodium phosphates injection', role: 'electrolyte', perMl: { Na: 4, phosphate: 3 }, mOsmPerMl: 7, orderSpecies: 'phosphate' },
      { id: 'potassium-phosphates-3', name: 'Potassium phosphates injection', role: 'electrolyte', perMl: { K: '4.4', phosphate: 3 }, mOsmPerMl: '7.4', orderSpecies: 'phosphate' },
      // calcium gluconate 10% 680 mOsm/L (D8); magnesium sulfate 50% 4060 mOsm/L (D10)
      { id: 'calcium-gluconate-10', name: 'Calcium gluconate 10% injection', role: 'electrolyte', perMl: { Ca: '0.2325', gluconate: '0.465' }, mOsmPerMl: '0.68', orderSpecies: 'Ca' },
      { id: 'magnesium-sulfate-50', name: 'Magnesium sulfate 50% injection', role: 'electrolyte', perMl: { Mg: '2.03', sulfate: '2.03' }, mOsmPerMl: '4.06', orderSpecies: 'Mg' },
      { id: 'sterile-water', name: 'Sterile water for injection', role: 'water', mOsmPerMl: 0 },
    ],
  });
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
})();

describe('field guide §9.4 D1: adult central 2-in-1, 2000 mL/day, 70 kg', () => {
  const e = evaluate({
    age: 'adult', route: 'central', weightKg: 70, volumeMl: 2000, hours: 24,
    lines: [
      { product: 'amino-acids', amount: 100, unit: 'g' },
      { product: 'dextrose-70', amount: 300, unit: 'g' },
      { product: 'sodium-chloride-4', amount: 60, unit: 'mEq' },
      { product: 'sodium-acetate-2', amount: 40, unit: 'mEq' },
      { product: 'potassium-chloride-2', amount: 40, unit: 'mEq' },
      { product: 'potassium-phosphates-3', amount: 15, unit: 'mmol' },
      { product: 'calcium-gluconate-10', amount: 10, unit: 'mEq' },
      { product: 'magnesium-sulfate-50', amount: 16, unit: 'mEq' },
      { product: 'sterile-water', fill: true },
    ],
  }, DEFAULT_POLICY, guideCatalog);

  it('label-factor osmolarity 2861.5 mOsm → 1430.7 mOsm/L, so a central line', () => {
    expect(e.report.osmolarity.labelSum).toBe(1430.7);
    expect(pick(e.findings, 'osmolarity-peripheral')).toEqual([]); // central: the route check does not apply
    const reverse = e.report.suggestions?.find((s) => s.kind === 'peripheral-route');
    expect(reverse?.status).toBe('unavailable');
    expect(reverse?.message).toContain('Needs the central line');
  });

  it('energy: dextrose 1020 kcal, amino acids 400 kcal; N 16 g; NPC:N 64 (no lipid), shown as information', () => {
    expect(e.report.totals.kcal.dextrose).toBe(1020);
    expect(e.report.totals.kcal.aminoAcids).toBe(400);
    expect(e.report.totals.nitrogenG).toBe(16);
    const npc = one(e.findings, 'dose-range', { nutrient: 'npcToN' });
    expect(npc.value?.toDecimalPlaces(0).toNumber()).toBe(64);
    expect(npc.severity).toBe('info');
  });

  it('GIR 2.98 mg/kg/min, within the adult range', () => {
    const gir = one(e.findings, 'gir');
    expect(gir.value?.toDecimalPlaces(2).toNumber()).toBe(2.98);
    expect(gir.severity).toBe('info');
  });

  it('potassium phosphates 15 mmol (5 mL) bring 22 mEq potassium', () => {
    expect(e.report.totals.mmolPerDay.K).toBe(62);
  });

  it('a 2-in-1 gets no 3-in-1 stability findings; the Ca-P product 2.5 × 7.5 = 18.8 passes the central screen', () => {
    expect(pick(e.findings, 'tna-stability')).toEqual([]);
    const product = one(e.findings, 'calcium-phosphate', { screen: 'product' });
    expect(product.value?.toDecimalPlaces(2).toNumber()).toBe(18.75);
    expect(product.severity).toBe('info');
  });

  it('its report validates against the report schema', () => {
    expect(reportSchema.safeParse(e.report).success).toBe(true);
  });
});

describe('field guide §9.4 D2: adult peripheral 3-in-1, 2500 mL/day', () => {
  const e = evaluate({
    age: 'adult', route: 'peripheral', weightKg: 70, volumeMl: 2500, hours: 24,
    lines: [
      { product: 'amino-acids', amount: 75, unit: 'g' },
      { product: 'dextrose-70', amount: 125, unit: 'g' },
      { product: 'lipid-20', amount: 250, unit: 'mL' },
      { product: 'sodium-chloride-4', amount: 80, unit: 'mEq' },
      { product: 'potassium-chloride-2', amount: 40, unit: 'mEq' },
      { product: 'sodium-phosphates-3', amount: 10, unit: 'mmol' },
      { product: 'calcium-gluconate-10', amount: 20, unit: 'mL' },
      { product: 'magnesium-sulfate-50', amount: 10, unit: 'mEq' },
      { product: 'sterile-water', fill: true },
    ],
  }, DEFAULT_POLICY, guideCatalog);

  it('1732.7 mOsm → 693 mOsm/L: passes ≤ 900', () => {
    expect(e.report.osmolarity.labelSum).toBeCloseTo(693, 0); // 1732.7 ÷ 2.5 = 693.1
    expect(pick(e.findings, 'osmolarity-peripheral')).toEqual([]);
    expect(e.report.suggestions).toBeUndefined();
  });

  it('final AA 3.0%, dextrose 5.0%, ILE 2.0%: fails the ASPEN 3-in-1 minimums for AA and dextrose (a warning, not a stop)', () => {
    const aa = one(e.findings, 'tna-stability', { nutrient: 'amino-acids' });
    const dex = one(e.findings, 'tna-stability', { nutrient: 'dextrose' });
    const lipid = one(e.findings, 'tna-stability', { nutrient: 'lipid' });
    expect([aa.value?.toNumber(), dex.value?.toNumber(), lipid.value?.toNumber()]).toEqual([3, 5, 2]);
    expect([aa.severity, dex.severity, lipid.severity]).toEqual(['warn', 'warn', 'info']);
    expect(e.verdict).toBe('warn');
  });

  it('cations: monovalent 53.3, Ca 1.86, Mg 2.0 mmol/L → CAN = 53.3 + 64 × 3.86 ≈ 300, as information', () => {
    expect(e.report.totals.mmolPerL.Ca).toBe(1.86);
    expect(e.report.totals.mmolPerL.Mg).toBe(2);
    expect(e.report.totals.mmolPerL.Na + e.report.totals.mmolPerL.K).toBeCloseTo(53.33, 1);
    const can = one(e.findings, 'tna-stability', { screen: 'critical-aggregation-number' });
    expect(can.value?.toDecimalPlaces(0).toNumber()).toBe(300);
    expect(can.severity).toBe('info');
  });

  it('energy: dextrose 425 + amino acids 300 + lipid 500 = 1225 kcal', () => {
    expect(e.report.totals.kcal).toMatchObject({ dextrose: 425, aminoAcids: 300, lipid: 500, total: 1225 });
  });

  it('a 3-in-1 with calcium and phosphate carries the "precipitate cannot be seen" note', () => {
    expect(one(e.findings, 'calcium-phosphate', { screen: 'hidden-by-lipid' }).severity).toBe('info');
  });
});
