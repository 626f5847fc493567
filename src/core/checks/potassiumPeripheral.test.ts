import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { potassiumPeripheral } from './potassiumPeripheral.ts';
import type { Route } from '../order.ts';
import { bagOf, type OrderSpec } from '../../../test/helpers/orders.ts';

function bag(age: OrderSpec['age'], route: Route, kMmol: string) {
  return bagOf({ age, route, weightKg: 10, volumeMl: 1000, lines: [
    { product: 'potassium-chloride-2', amount: kMmol, unit: 'mmol', species: 'K' },
    { product: 'sterile-water', fill: true },
  ] });
}

// No PN guideline sets a peripheral potassium limit: the shipped limits are derived from the
// potassium phosphates injection label, Table 1 (field guide §2.3): 100 mEq/L peripherally for
// adults and children ≥ 12 y (policy keeps 80), 40 mEq/L for children < 12 y (applied to neonates).
describe('potassium-peripheral', () => {
  it.each([
    ['adult', '80', 'info'], ['adult', '79.9', 'info'], ['adult', '80.1', 'warn'],
    ['child', '40', 'info'], ['child', '39.9', 'info'], ['child', '40.1', 'warn'],
    ['term-neonate', '40', 'info'], ['term-neonate', '39.9', 'info'], ['term-neonate', '40.1', 'warn'],
    ['preterm-neonate', '40', 'info'], ['preterm-neonate', '39.9', 'info'], ['preterm-neonate', '40.1', 'warn'],
  ] as const)('%s peripheral bag with %s mmol/L potassium is %s', (age, k, severity) => {
    const findings = potassiumPeripheral(bag(age, 'peripheral', k), DEFAULT_POLICY);
    expect(findings).toHaveLength(1);
    expect(findings[0]?.severity).toBe(severity);
    expect(findings[0]?.source).toContain('derived from label limits');
  });

  it('does not apply to a central bag', () => {
    expect(potassiumPeripheral(bag('adult', 'central', '150'), DEFAULT_POLICY)).toEqual([]);
  });

  it('counts potassium from every stock, phosphate salts included (potassium phosphates: 4.4 mEq K per mL, label)', () => {
    const b = bagOf({ age: 'child', route: 'peripheral', weightKg: 10, volumeMl: 1000, lines: [
      { product: 'potassium-phosphates-3', amount: 30, unit: 'mmol', species: 'phosphate' }, // 10 mL → 44 mmol K
      { product: 'sterile-water', fill: true },
    ] });
    const [f] = potassiumPeripheral(b, DEFAULT_POLICY);
    expect(f?.value?.toNumber()).toBe(44);
    expect(f?.severity).toBe('warn');
  });
});
