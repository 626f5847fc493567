import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { parseOrder } from '../order.ts';
import { formatProblem } from '../problems.ts';
import { computeBag } from '../compute/bag.ts';
import type { D } from '../decimal.ts';
import { compoundOrder, hasIons, withAllocatedLines, type CompoundResult } from './compoundOrder.ts';

// Stock compositions used below are the shipped catalog's label values (field guide §1.3, §6.1):
//   potassium phosphates 3 mmol P + 4.4 mEq K per mL (FDA label)
//   sodium phosphates 3 mmol P + 4 mEq Na per mL (FDA label)
//   sodium glycerophosphate 1 mmol P + 2 mmol Na per mL (drug monograph)
//   calcium gluconate 10% 0.465 mEq Ca per mL (ASHP Handbook on Injectable Drugs)
//   magnesium sulfate 50% 4.06 mEq Mg per mL (label / ASHP Handbook)
//   sodium chloride 23.4% 4 mEq/mL; sodium acetate, potassium chloride, potassium acetate 2 mEq/mL (labels)
//   amino acids 10%: Na 38, acetate 71.8 mEq/L; amino acids 15%: acetate 151 mEq/L (US labels)
// Volumes are rounded by the shipped policy: 0.1 mL at or above 1 mL, 0.01 mL below, halves up
// (common practice).

function compound(json: object): CompoundResult {
  const parsed = parseOrder(json, DEFAULT_CATALOG);
  if (!parsed.ok) throw new Error(parsed.problems.map(formatProblem).join('\n'));
  if (!hasIons(parsed.value)) throw new Error('test order has no ions block');
  return compoundOrder(parsed.value, DEFAULT_CATALOG, DEFAULT_POLICY);
}

function line(r: CompoundResult, product: string) {
  const found = r.lines.find((l) => l.product.id === product);
  if (!found) throw new Error(`no line of ${product}; lines: ${r.lines.map((l) => l.product.id).join(', ')}`);
  return found;
}

const s = (d: D): string => d.toString();

describe('hand-computed allocations', () => {
  it('adult: potassium phosphates and a 1:1 chloride:acetate preference over the whole bag', () => {
    const r = compound({
      id: 'T-ADULT-1', patient: { id: 'P1', weightKg: 70, ageGroup: 'adult' }, route: 'central', volumeMl: 2000,
      lines: [
        { product: 'amino-acids-15', amount: 75, unit: 'g' },
        { product: 'dextrose-70', amount: 210, unit: 'g' },
        { product: 'sterile-water', fill: true },
      ],
      ions: { per: 'day', Na: 93, K: 80, Ca: 10, Mg: 12, phosphate: 15, phosphateSalt: 'potassium', anions: { chlorideToAcetate: 1 } },
    });
    expect(r.problems).toEqual([]);
    expect(r.feasible).toBe(true);
    // Amino acids 15%: 75 g ÷ 0.15 g/mL = 500 mL; acetate 500 × 0.151 = 75.5 mEq.
    expect(s(r.otherLines.acetate)).toBe('75.5');
    // Potassium phosphates: 15 mmol ÷ 3 mmol/mL = 5 mL, bringing 5 × 4.4 = 22 mEq K.
    expect(s(line(r, 'potassium-phosphates-3').volumeMl)).toBe('5');
    expect(s(line(r, 'potassium-phosphates-3').ionsMeasured.K)).toBe('22');
    // Calcium gluconate: 10 mEq ÷ 0.465 = 21.505… mL → 21.5 mL → 21.5 × 0.465 = 9.9975 mEq.
    expect(line(r, 'calcium-gluconate-10').exactVolumeMl.toNumber()).toBeCloseTo(21.505376, 6);
    expect(s(line(r, 'calcium-gluconate-10').volumeMl)).toBe('21.5');
    expect(s(line(r, 'calcium-gluconate-10').measuredAmount)).toBe('9.9975');
    // Magnesium sulfate: 12 mEq ÷ 4.06 = 2.9557 mL → 3.0 mL → 12.18 mEq.
    expect(s(line(r, 'magnesium-sulfate-50').volumeMl)).toBe('3');
    expect(s(line(r, 'magnesium-sulfate-50').measuredAmount)).toBe('12.18');
    // Left for chloride/acetate salts: Na 93, K 80 − 22 = 58; S = 151 mEq.
    // 1:1 over the bag: Cl = x, acetate = 75.5 + 151 − x → x = 226.5 ÷ 2 = 113.25 = 0.75 × 151.
    // NaCl 0.75 × 93 = 69.75 mEq (17.4375 mL → 17.4 mL = 69.6 mEq); NaAc 23.25 (11.625 → 11.6 mL = 23.2 mEq)
    // KCl 0.75 × 58 = 43.5 (21.75 → 21.8 mL = 43.6 mEq); KAc 14.5 (7.25 → 7.3 mL = 14.6 mEq).
    expect(s(line(r, 'sodium-chloride-4').amount)).toBe('69.75');
    expect(s(line(r, 'sodium-chloride-4').volumeMl)).toBe('17.4');
    expect(s(line(r, 'sodium-acetate-2').amount)).toBe('23.25');
    expect(s(line(r, 'sodium-acetate-2').volumeMl)).toBe('11.6');
    expect(s(line(r, 'potassium-chloride-2').amount)).toBe('43.5');
    expect(s(line(r, 'potassium-chloride-2').volumeMl)).toBe('21.8');
    expect(s(line(r, 'potassium-acetate-2').amount)).toBe('14.5');
    expect(s(line(r, 'potassium-acetate-2').volumeMl)).toBe('7.3');
    // Before rounding the order is met exactly and chloride equals acetate (113.25 each).
    expect(s(r.deliveredExact.Na)).toBe('93');
    expect(s(r.deliveredExact.K)).toBe('80');
    expect(s(r.deliveredExact.Cl)).toBe('113.25');
    expect(s(r.deliveredExact.acetate)).toBe('113.25');
    // After rounding: Na 69.6 + 23.2 = 92.8; K 22 + 43.6 + 14.6 = 80.2; Cl 69.6 + 43.6 = 113.2;
    // acetate 75.5 + 23.2 + 14.6 = 113.3; phosphate 15.
    expect(s(r.delivered.Na)).toBe('92.8');
    expect(s(r.delivered.K)).toBe('80.2');
    expect(s(r.delivered.Ca)).toBe('9.9975');
    expect(s(r.delivered.Mg)).toBe('12.18');
    expect(s(r.delivered.phosphate)).toBe('15');
    expect(s(r.delivered.Cl)).toBe('113.2');
    expect(s(r.delivered.acetate)).toBe('113.3');
    // The fill absorbs the rounding: 2000 − (500 + 300 + 5 + 21.5 + 3 + 17.4 + 11.6 + 21.8 + 7.3) = 1112.4 mL.
    const bag = computeBag(r.compounded, DEFAULT_POLICY);
    const fill = bag.lines.find((l) => l.line.kind === 'fill');
    expect(fill && s(fill.volumeMl)).toBe('1112.4');
    expect(s(bag.finalVolumeMl)).toBe('2000');
  });

  it('preterm neonate, per kg: organic phosphate (sodium glycerophosphate) and acetate salts', () => {
    const r = compound({
      id: 'T-NEO-1', patient: { id: 'P2', weightKg: '1.5', ageGroup: 'preterm-neonate' }, route: 'central', volumeMl: 225,
      lines: [
        { product: 'amino-acids-10', amount: '3.5', unit: 'g/kg' },
        { product: 'dextrose-50', amount: 12, unit: 'g/kg' },
        { product: 'sterile-water', fill: true },
      ],
      ions: { per: 'kg', Na: 5, K: 2, Ca: 3, Mg: '0.4', phosphate: '1.6', phosphateSalt: 'organic', anions: 'acetate' },
    });
    expect(r.problems).toEqual([]);
    // Per bag (× 1.5 kg): Na 7.5, K 3, Ca 4.5, Mg 0.6 mEq, phosphate 2.4 mmol.
    expect(s(r.ordered.Na)).toBe('7.5');
    expect(s(r.ordered.phosphate)).toBe('2.4');
    // Amino acids 10%: 3.5 × 1.5 = 5.25 g → 52.5 mL; Na 52.5 × 0.038 = 1.995, acetate 52.5 × 0.0718 = 3.7695 mEq.
    expect(s(r.otherLines.Na)).toBe('1.995');
    expect(s(r.otherLines.acetate)).toBe('3.7695');
    // Sodium glycerophosphate: 2.4 mmol ÷ 1 mmol/mL = 2.4 mL, bringing 2.4 × 2 = 4.8 mEq Na.
    const gp = line(r, 'sodium-glycerophosphate-1');
    expect(gp.species).toBe('glycerophosphate');
    expect(s(gp.volumeMl)).toBe('2.4');
    expect(s(gp.ionsMeasured.Na)).toBe('4.8');
    // Calcium gluconate: 4.5 ÷ 0.465 = 9.677 mL → 9.7 mL → 4.5105 mEq.
    expect(s(line(r, 'calcium-gluconate-10').volumeMl)).toBe('9.7');
    expect(s(line(r, 'calcium-gluconate-10').measuredAmount)).toBe('4.5105');
    // Magnesium sulfate: 0.6 ÷ 4.06 = 0.1478 mL, below 1 mL so to 0.01 mL → 0.15 mL → 0.609 mEq.
    expect(s(line(r, 'magnesium-sulfate-50').volumeMl)).toBe('0.15');
    expect(s(line(r, 'magnesium-sulfate-50').measuredAmount)).toBe('0.609');
    // Sodium left: 7.5 − 1.995 − 4.8 = 0.705 mEq, all as acetate: 0.3525 mL → 0.35 mL → 0.7 mEq.
    expect(s(line(r, 'sodium-acetate-2').amount)).toBe('0.705');
    expect(s(line(r, 'sodium-acetate-2').volumeMl)).toBe('0.35');
    // Potassium 3 mEq as acetate: 1.5 mL exactly. No chloride salt at all.
    expect(s(line(r, 'potassium-acetate-2').volumeMl)).toBe('1.5');
    expect(r.lines.some((l) => l.product.id.includes('chloride'))).toBe(false);
    // Delivered: Na 1.995 + 4.8 + 0.7 = 7.495; acetate 3.7695 + 0.7 + 3 = 7.4695; Cl 0; P 2.4 (organic).
    expect(s(r.delivered.Na)).toBe('7.495');
    expect(s(r.delivered.acetate)).toBe('7.4695');
    expect(s(r.delivered.Cl)).toBe('0');
    expect(s(r.delivered.phosphate)).toBe('2.4');
    // Fill: 225 − (52.5 + 36 + 2.4 + 9.7 + 0.15 + 0.35 + 1.5) = 122.4 mL.
    const fill = computeBag(r.compounded, DEFAULT_POLICY).lines.find((l) => l.line.kind === 'fill');
    expect(fill && s(fill.volumeMl)).toBe('122.4');
  });

  it('auto phosphate for a preterm neonate follows the policy age-group order (organic first)', () => {
    const r = compound({
      id: 'T-NEO-2', patient: { id: 'P2', weightKg: '1.5', ageGroup: 'preterm-neonate' }, route: 'central', volumeMl: 225,
      lines: [{ product: 'sterile-water', fill: true }],
      ions: { per: 'kg', Na: 4, phosphate: 1, anions: 'acetate' },
    });
    expect(r.lines.map((l) => l.product.id)).toEqual(['sodium-glycerophosphate-1', 'sodium-acetate-2']);
  });

  it('an amino-acid product that brings sodium and acetate: its ions are subtracted first', () => {
    const r = compound({
      id: 'T-AA-NA', patient: { id: 'P3', weightKg: 80, ageGroup: 'adult' }, route: 'central', volumeMl: 2000,
      lines: [
        { product: 'amino-acids-10', amount: 100, unit: 'g' },
        { product: 'dextrose-70', amount: 280, unit: 'g' },
        { product: 'sterile-water', fill: true },
      ],
      ions: { per: 'day', Na: 80, K: 60, phosphate: 15, phosphateSalt: 'sodium', anions: { chloride: 41 } },
    });
    expect(r.problems).toEqual([]);
    // Amino acids 10%: 100 g → 1000 mL: Na 38, acetate 71.8 mEq (label Na 38, acetate 71.8 mEq/L).
    expect(s(r.otherLines.Na)).toBe('38');
    expect(s(r.otherLines.acetate)).toBe('71.8');
    // Sodium phosphates: 15 mmol → 5 mL, bringing 5 × 4 = 20 mEq Na.
    expect(s(line(r, 'sodium-phosphates-3').ionsMeasured.Na)).toBe('20');
    // Left: Na 80 − 38 − 20 = 22; K 60; S = 82. Chloride 41 over the bag (none from other lines):
    // x = 41 = 0.5 × 82 → NaCl 11, NaAc 11, KCl 30, KAc 30 mEq.
    expect(s(line(r, 'sodium-chloride-4').amount)).toBe('11');
    expect(s(line(r, 'sodium-acetate-2').amount)).toBe('11');
    expect(s(line(r, 'potassium-chloride-2').amount)).toBe('30');
    expect(s(line(r, 'potassium-acetate-2').amount)).toBe('30');
    // NaCl 11 ÷ 4 = 2.75 mL → 2.8 mL (halves up) = 11.2 mEq; the others measure exactly (5.5, 15, 15 mL).
    expect(s(line(r, 'sodium-chloride-4').volumeMl)).toBe('2.8');
    // Delivered: Na 38 + 20 + 11.2 + 11 = 80.2; Cl 11.2 + 30 = 41.2; acetate 71.8 + 11 + 30 = 112.8.
    expect(s(r.delivered.Na)).toBe('80.2');
    expect(s(r.delivered.K)).toBe('60');
    expect(s(r.delivered.Cl)).toBe('41.2');
    expect(s(r.delivered.acetate)).toBe('112.8');
    expect(s(r.ordered.Cl)).toBe('41');
    expect(r.unordered).toEqual(['Ca', 'Mg', 'acetate']);
  });
});

describe('the demo ion order (journey 4)', () => {
  const demo = DEMO_ORDERS.find((d) => d.key === 'adult-ions');

  it('is registered, parses, and is met with potassium phosphates bringing 29.33 mEq K', () => {
    expect(demo).toBeDefined();
    const r = compound(demo?.file as object);
    expect(r.feasible).toBe(true);
    // Policy auto order: potassium first. 20 mmol × 4.4/3 = 29.333 mEq K (journey 4: "its 29 mEq of potassium").
    const kp = line(r, 'potassium-phosphates-3');
    expect(kp.ionsExact.K.toNumber()).toBeCloseTo(29.3333, 4);
    // Acetate-leaning 1 : 2 before rounding: chloride ÷ acetate = 0.5.
    expect(r.deliveredExact.Cl.div(r.deliveredExact.acetate).toNumber()).toBeCloseTo(0.5, 12);
  });
});

describe('withAllocatedLines', () => {
  it('adds the allocated lines at their measured amounts and clears the ion block', () => {
    const parsed = parseOrder({
      id: 'T-W', patient: { id: 'P', weightKg: 70, ageGroup: 'adult' }, route: 'central', volumeMl: 1000,
      lines: [{ product: 'sterile-water', fill: true }],
      ions: { per: 'day', Mg: 8 },
    }, DEFAULT_CATALOG);
    if (!parsed.ok) throw new Error('invalid');
    const out = withAllocatedLines(parsed.value, DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(out.ions).toBeNull();
    // 8 mEq ÷ 4.06 mEq/mL = 1.970 mL → 2.0 mL → 8.12 mEq Mg, on line index 1 (after the fill line 0).
    const added = out.lines[1];
    expect(added?.kind === 'amount' && added.index === 1 && added.unit === 'mEq' && added.amount.toString()).toBe('8.12');
    // An order without an ion block comes back as it is.
    expect(withAllocatedLines(out, DEFAULT_CATALOG, DEFAULT_POLICY)).toBe(out);
  });
});
