import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG } from '../../defaults.ts';
import { DEMO_ORDERS } from '../../defaults.ts';
import { checkOrder } from '../../core/evaluate.ts';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { docFromFile, toOrderFile } from './draft.ts';
import { setProduct, setUnit } from './edits.ts';
import { defaultUnit, speciesChoices, unitChoices } from './lineUnits.ts';

const product = (id: string) => {
  const p = DEFAULT_CATALOG.byId.get(id);
  if (!p) throw new Error(id);
  return p;
};

describe('units that make sense for a stock', () => {
  it('every unit offered for every shipped stock is accepted by the engine', () => {
    // The picker must never offer what parseOrder refuses (exchange format: g only for nutrients, no mEq of phosphate).
    for (const p of DEFAULT_CATALOG.products) {
      for (const unit of unitChoices(p)) {
        const base = unit.replace('/kg', '');
        const species = base === 'mEq' || base === 'mmol' ? speciesChoices(p, base) : [undefined];
        for (const s of species) {
          const line = { product: p.id, amount: '1', unit, ...(s ? { species: s } : {}) };
          const r = checkOrder({ id: 'U', patient: { id: 'P', weightKg: 70, ageGroup: 'adult' }, route: 'central', lines: [line] }, DEFAULT_CATALOG, DEFAULT_POLICY);
          expect(r.ok, `${p.id} ${unit} ${s ?? ''}: ${r.ok ? '' : JSON.stringify(r.problems)}`).toBe(true);
        }
      }
    }
  });

  it('phosphate is never counted in mEq; glycerophosphate stocks are ordered in mmol', () => {
    expect(speciesChoices(product('potassium-phosphates-3'), 'mEq')).toEqual(['K']);
    expect(speciesChoices(product('sodium-glycerophosphate-1'), 'mmol')).toEqual(['glycerophosphate', 'Na']);
    expect(defaultUnit(product('sodium-glycerophosphate-1'), true)).toBe('mmol/kg');
    expect(defaultUnit(product('calcium-gluconate-10'), false)).toBe('mEq');
    expect(unitChoices(product('lipid-20'))).toEqual(['g', 'g/kg', 'mL', 'mL/kg']);
  });

  it('switching stock or unit keeps the order valid when it can', () => {
    const r = docFromFile(DEMO_ORDERS[0]?.file);
    if (!r.ok) throw new Error('demo');
    // Line 5 (index 5) is potassium phosphates 15 mmol, species phosphate.
    let d = setUnit(r.value, 5, 'mEq', DEFAULT_CATALOG);
    expect(d.order.lines[5]).toMatchObject({ unit: 'mEq', species: 'K' });
    d = setProduct(d, 5, 'sodium-chloride-4', DEFAULT_CATALOG);
    expect(d.order.lines[5]).toEqual({ product: 'sodium-chloride-4', amount: '15', unit: 'mEq' });
    d = setUnit(d, 5, 'fill', DEFAULT_CATALOG);
    expect(d.order.lines[5]).toEqual({ product: 'sodium-chloride-4', fill: true });
    expect(checkOrder(toOrderFile(setUnit(d, 5, 'mmol', DEFAULT_CATALOG).order), DEFAULT_CATALOG, DEFAULT_POLICY).ok).toBe(false);
  });
});
