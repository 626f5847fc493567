import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { parseOrder, type Order } from '../order.ts';
import { computeBag } from '../compute/bag.ts';
import { evaluateOrder } from '../evaluate.ts';
import { batch } from '../../../test/bench/generate.ts';
import { findingChanges } from '../solve/consequences.ts';
import { CHECKS, ROUTE_CHECKS } from './index.ts';

function orders(): Order[] {
  const files: unknown[] = [...batch(150), ...DEMO_ORDERS.map((d) => d.file)];
  return files.flatMap((file) => {
    const parsed = parseOrder(file, DEFAULT_CATALOG);
    return parsed.ok ? [parsed.value] : [];
  });
}

describe('CHECKS and ROUTE_CHECKS', () => {
  const all = orders();

  it('every check outside ROUTE_CHECKS finds the same on either route (law, over generated and demo orders)', () => {
    expect(all.length).toBeGreaterThan(150);
    for (const order of all) {
      const central = computeBag({ ...order, route: 'central' }, DEFAULT_POLICY);
      const peripheral = computeBag({ ...order, route: 'peripheral' }, DEFAULT_POLICY);
      for (const check of CHECKS) {
        if (ROUTE_CHECKS.has(check)) continue;
        expect(check(peripheral, DEFAULT_POLICY)).toEqual(check(central, DEFAULT_POLICY));
      }
    }
  });

  it('the route re-check of a central bag finds what a full evaluation of the peripheral order finds', () => {
    let rechecked = 0;
    for (const order of all.filter((o) => o.route === 'central')) {
      const current = evaluateOrder(order, DEFAULT_CATALOG, DEFAULT_POLICY);
      const s = current.suggestions.find((x) => x.kind === 'peripheral-route');
      if (s?.status !== 'proposal') continue;
      rechecked++;
      const full = evaluateOrder(s.order, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false });
      expect(s.after.verdict).toBe(full.verdict);
      expect({ appears: s.appears, disappears: s.disappears }).toEqual(findingChanges(current.findings, full.findings));
    }
    expect(rechecked).toBeGreaterThan(0);
  });
});
