import { describe, expect, it } from 'vitest';
import { evaluate } from '../../../test/helpers/orders.ts';

describe('peripheral-route (the reverse question for a central bag)', () => {
  it('a dilute central bag would already pass peripherally: proposed, with what else it would bring', () => {
    // 1000 mL: dextrose 10% 500 mL (505 mOsm/L label → 252.5 mOsm), amino acids 10% 300 mL (840 → 252),
    // potassium chloride 60 mmol (30 mL at 4000 mOsm/L → 120): about 625 mOsm/L, under ASPEN 2014's 900;
    // but potassium 60 mmol/L is over the 40 mmol/L peripheral limit for a child (label-derived).
    const e = evaluate({ age: 'child', route: 'central', weightKg: 20, volumeMl: 1000, lines: [
      { product: 'dextrose-10', amount: 500, unit: 'mL' }, { product: 'amino-acids-10', amount: 300, unit: 'mL' },
      { product: 'potassium-chloride-2', amount: 60, unit: 'mmol', species: 'K' }, { product: 'sterile-water', fill: true },
    ] });
    const [s] = e.suggestions;
    expect(s?.kind).toBe('peripheral-route');
    expect(s?.status).toBe('proposal');
    if (s?.status !== 'proposal') return;
    expect(s.change).toEqual({ field: 'route', from: 'central', to: 'peripheral' });
    expect(s.passesOsmolarity).toBe(true);
    expect(s.after.osmolarity.toDecimalPlaces(1).toNumber()).toBe(624.5);
    expect(s.appears.map((f) => f.code)).toEqual(['potassium-peripheral']);
    expect(s.order.route).toBe('peripheral');
    expect(e.order.route).toBe('central');
  });

  it('a concentrated central bag needs the central line, and says by how much', () => {
    const e = evaluate({ age: 'adult', route: 'central', weightKg: 70, volumeMl: 2000, lines: [
      { product: 'amino-acids-15', amount: 100, unit: 'g' }, { product: 'dextrose-70', amount: 300, unit: 'g' }, { product: 'sterile-water', fill: true },
    ] });
    expect(e.report.suggestions).toEqual([{ kind: 'peripheral-route', status: 'unavailable', notes: [], message: expect.stringContaining('Needs the central line') }]);
  });
});
