import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY } from '../../defaults.ts';
import { parseCatalog, type Catalog } from '../catalog.ts';
import { tnaStability, criticalAggregationNumber, dextroseMonohydratePercent } from './tnaStability.ts';
import { AGES, bagOf, one, pick, policyWith, type OrderSpec } from '../../../test/helpers/orders.ts';

type Age = OrderSpec['age'];

/**
 * A 1000 mL 3-in-1 (so g = %×10): amino acids 10% (g), dextrose 70% (g), lipid emulsion 20% (g),
 * water to volume. Defaults meet the ASPEN 2014 minimums comfortably.
 */
function tna(age: Age, g: { aa?: string; dextrose?: string; lipid?: string } = {}, extra: OrderSpec['lines'] = []) {
  return bagOf({
    age, route: 'central', weightKg: age === 'adult' ? 70 : 10, volumeMl: 1000,
    lines: [
      { product: 'amino-acids-10', amount: g.aa ?? '50', unit: 'g' },
      { product: 'dextrose-70', amount: g.dextrose ?? '150', unit: 'g' },
      { product: 'lipid-20', amount: g.lipid ?? '30', unit: 'g' },
      ...extra,
      { product: 'sterile-water', fill: true },
    ],
  });
}

describe('tna-stability', () => {
  // ASPEN 2014 (Boullata et al.), strong: final amino acids ≥ 4%, dextrose monohydrate ≥ 10%, lipid ≥ 2%.
  describe.each(AGES)('%s (ASPEN 2014 minimums)', (age) => {
    it.each([
      ['amino-acids', 'aa', '40', 'info'], ['amino-acids', 'aa', '40.1', 'info'], ['amino-acids', 'aa', '39.9', 'warn'],
      ['dextrose', 'dextrose', '100', 'info'], ['dextrose', 'dextrose', '100.1', 'info'], ['dextrose', 'dextrose', '99.9', 'warn'],
      ['lipid', 'lipid', '20', 'info'], ['lipid', 'lipid', '20.1', 'info'], ['lipid', 'lipid', '19.9', 'warn'],
    ] as const)('%s: %s %s g/L is %s', (nutrient, key, grams, severity) => {
      const f = one(tnaStability(tna(age, { [key]: grams }), DEFAULT_POLICY), 'tna-stability', { nutrient });
      expect(f.severity).toBe(severity);
      expect(f.limit?.toNumber()).toBe({ 'amino-acids': 4, dextrose: 10, lipid: 2 }[nutrient]);
      expect(f.source).toContain('ASPEN 2014');
    });

    // Divalent cations Ca + Mg ≤ 8 mmol/L (from memory: manufacturers' screens 8-10 mmol/L).
    it.each([
      ['8', 'info'], ['7.99', 'info'], ['8.01', 'warn'],
    ])('divalent cations %s mmol/L (magnesium sulfate) are %s', (mg, severity) => {
      const f = one(tnaStability(tna(age, {}, [{ product: 'magnesium-sulfate-50', amount: mg, unit: 'mmol', species: 'Mg' }]), DEFAULT_POLICY), 'tna-stability', { screen: 'divalent-cations' });
      expect(f.severity).toBe(severity);
      expect(f.limit?.toNumber()).toBe(8);
    });
  });

  it('only screens bags with lipid', () => {
    expect(tnaStability(tna('adult', { lipid: '0' }), DEFAULT_POLICY)).toEqual([]);
  });

  it('CAN = a + 64b + 729c (Schulze–Hardy weights; field guide §4.3): 53.3 + 64 × 3.86 = 300.3', () => {
    expect(criticalAggregationNumber({ monovalent: new D('53.3'), divalent: new D('3.86'), trivalent: new D(0) }).toString()).toBe('300.34');
    expect(criticalAggregationNumber({ monovalent: new D(0), divalent: new D(0), trivalent: new D(1) }).toString()).toBe('729');
  });

  it('shows CAN as information with its formula and no threshold by default (no reliable published one)', () => {
    const bag = tna('adult', {}, [{ product: 'sodium-chloride-4', amount: 50, unit: 'mmol', species: 'Na' }, { product: 'magnesium-sulfate-50', amount: 2, unit: 'mmol', species: 'Mg' }]);
    const f = one(tnaStability(bag, DEFAULT_POLICY), 'tna-stability', { screen: 'critical-aggregation-number' });
    expect(f.severity).toBe('info');
    expect(f.limit).toBeNull();
    // amino acids 10% bring 0.038 mmol Na/mL: 500 mL → 19 mmol, + 50 → a = 69; b = 2 → CAN = 69 + 128 = 197.
    expect(f.value?.toNumber()).toBe(197);
    expect(f.message).toContain('CAN = a + 64b + 729c');
    expect(f.message).toContain('no threshold is set');
  });

  it('a policy can set a CAN threshold, and then it is compared', () => {
    const policy = policyWith((p) => { p.rules['tna-can'].all = { max: 150, unit: 'mmol/L', severity: 'warn', source: 'test policy: a local CAN threshold (common practice, unverified)' }; });
    const bag = tna('adult', {}, [{ product: 'magnesium-sulfate-50', amount: 2, unit: 'mmol', species: 'Mg' }]);
    // a = 19 (amino acids' sodium), b = 2 → 147: under 150.
    expect(one(tnaStability(bag, policy), 'tna-stability', { screen: 'critical-aggregation-number' }).severity).toBe('info');
    const more = tna('adult', {}, [{ product: 'magnesium-sulfate-50', amount: '2.1', unit: 'mmol', species: 'Mg' }]);
    expect(one(tnaStability(more, policy), 'tna-stability', { screen: 'critical-aggregation-number' }).severity).toBe('warn');
  });

  it('counts anhydrous glucose as monohydrate for the 10% minimum (198.17 / 180.16 g/mol)', () => {
    const glucose = {
      id: 'glucose-anhydrous-50', name: 'Glucose 50% injection (anhydrous)', role: 'dextrose',
      nutrient: { gramsPerMl: '0.5', mOsmPerGram: '5.551', basis: 'anhydrous' }, mOsmPerMl: '2.775',
    };
    const parsed = parseCatalog({ ...(DEFAULT_FILES.catalog as object), products: [...(DEFAULT_FILES.catalog as { products: unknown[] }).products, glucose] });
    if (!parsed.ok) throw new Error('test catalog invalid');
    const catalog: Catalog = parsed.value;
    const spec = (g: string): OrderSpec => ({ age: 'adult', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'amino-acids-10', amount: 50, unit: 'g' }, { product: 'glucose-anhydrous-50', amount: g, unit: 'g' },
      { product: 'lipid-20', amount: 30, unit: 'g' }, { product: 'sterile-water', fill: true },
    ] });
    // 100 g monohydrate = 100 × 180.16/198.17 = 90.911 g anhydrous.
    expect(dextroseMonohydratePercent(bagOf(spec('90.92'), DEFAULT_POLICY, catalog)).toDecimalPlaces(3).toNumber()).toBe(10.001);
    expect(one(tnaStability(bagOf(spec('90.92'), DEFAULT_POLICY, catalog), DEFAULT_POLICY), 'tna-stability', { nutrient: 'dextrose' }).severity).toBe('info');
    expect(one(tnaStability(bagOf(spec('90.9'), DEFAULT_POLICY, catalog), DEFAULT_POLICY), 'tna-stability', { nutrient: 'dextrose' }).severity).toBe('warn');
    expect(DEFAULT_CATALOG.byId.has('glucose-anhydrous-50')).toBe(false);
  });

  it('lists the lines that set each figure', () => {
    const findings = tnaStability(tna('adult', { aa: '30' }), DEFAULT_POLICY);
    expect(one(findings, 'tna-stability', { nutrient: 'amino-acids' }).lines).toEqual([0]);
    expect(pick(findings, 'tna-stability').every((f) => f.code === 'tna-stability')).toBe(true);
  });
});
