import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY } from '../../defaults.ts';
import { makeCatalog, type Catalog } from '../catalog.ts';
import { parseOrder } from '../order.ts';
import { parsePolicy, type Policy } from '../policy.ts';
import { formatProblem } from '../problems.ts';
import { compoundOrder, compoundTargets, hasIons, type CompoundResult } from './compoundOrder.ts';

// Infeasible ion orders: each named reason, its proposal, and the proposal checked again.
// Stock compositions are the shipped catalog's label values (field guide §1.3, §6.1): sodium
// phosphates 4 mEq Na per 3 mmol P; potassium phosphates 4.4 mEq K per 3 mmol P; sodium
// glycerophosphate 2 mEq Na per mmol P; amino acids 10% Na 38 mEq/L; amino acids 15% acetate
// 151 mEq/L; calcium chloride 10% 1.36 mEq Ca per mL; magnesium sulfate 50% 4.06 mEq/mL.

type Json = Record<string, unknown>;

function orderJson(ions: Json, lines: Json[] = [], patient: Json = { id: 'P', weightKg: 70, ageGroup: 'adult' }): Json {
  return { id: 'T-INF', patient, route: 'central', volumeMl: 2000, lines: [...lines, { product: 'sterile-water', fill: true }], ions };
}

function compound(json: Json, catalog: Catalog = DEFAULT_CATALOG, policy: Policy = DEFAULT_POLICY): CompoundResult {
  const parsed = parseOrder(json, catalog);
  if (!parsed.ok) throw new Error(parsed.problems.map(formatProblem).join('\n'));
  if (!hasIons(parsed.value)) throw new Error('no ions');
  return compoundOrder(parsed.value, catalog, policy);
}

/** The proposal, compounded as a new order: it must be feasible (no blocking problem). */
function proposalAgain(json: Json, r: CompoundResult, catalog: Catalog = DEFAULT_CATALOG, policy: Policy = DEFAULT_POLICY): CompoundResult {
  expect(r.proposal).not.toBeNull();
  return compound({ ...json, ions: r.proposal }, catalog, policy);
}

function without(...ids: string[]): Catalog {
  return makeCatalog(DEFAULT_CATALOG.products.filter((p) => !ids.includes(p.id)));
}

function policyWith(change: (p: Json) => void): Policy {
  const json = structuredClone(DEFAULT_FILES.policy) as Json;
  change(json);
  const parsed = parsePolicy(json);
  if (!parsed.ok) throw new Error(parsed.problems.map(formatProblem).join('\n'));
  return parsed.value;
}

const AA15 = { product: 'amino-acids-15', amount: 75, unit: 'g' }; // 500 mL, acetate 75.5 mEq
const codes = (r: CompoundResult): string[] => r.problems.map((p) => p.code);
const ids = (r: CompoundResult): string[] => r.lines.map((l) => l.product.id);

describe('sodium or potassium below what the phosphate salt alone brings', () => {
  it('refuses sodium phosphates for 20 mmol P when 20 mEq Na is ordered, and proposes potassium phosphates', () => {
    const json = orderJson({ per: 'day', Na: 20, K: 80, phosphate: 20, phosphateSalt: 'sodium', anions: 'chloride' }, [AA15]);
    const r = compound(json);
    // Sodium phosphates: 20 mmol × 4/3 = 26.67 mEq Na > 20 ordered. Potassium phosphates: 20 × 4.4/3 = 29.33 ≤ 80.
    expect(codes(r)).toEqual(['phosphate-cation-exceeds-order']);
    const p = r.problems[0];
    expect(p?.severity).toBe('block');
    expect(p?.ion).toBe('Na');
    expect(p?.message).toContain('26.67 mEq');
    expect(p?.proposal?.change).toEqual({ phosphateSalt: 'potassium' });
    expect(r.feasible).toBe(false);
    // The lines meet the proposal: potassium phosphates, then Na 20 and K 80 − 29.33 = 50.67 as chloride.
    expect(ids(r)).toEqual(['potassium-phosphates-3', 'sodium-chloride-4', 'potassium-chloride-2']);
    expect(r.lines[2]?.amount.toNumber()).toBeCloseTo(50.6667, 4);
    expect(r.proposal).toEqual({ per: 'day', Na: 20, K: 80, phosphate: 20, phosphateSalt: 'potassium', anions: 'chloride' });
    const again = proposalAgain(json, r);
    expect(again.problems).toEqual([]);
  });

  it('when no phosphate salt fits, proposes the most phosphate any salt allows', () => {
    const json = orderJson({ per: 'day', Na: 10, K: 10, phosphate: 20, anions: 'chloride' }, [AA15]);
    const r = compound(json);
    // Most phosphate within 10 mEq: potassium 10 ÷ (4.4/3) = 6.82; sodium 10 ÷ (4/3) = 7.5; organic 10 ÷ 2 = 5 mmol.
    expect(codes(r)).toEqual(['phosphate-cation-exceeds-order']);
    expect(r.problems[0]?.proposal?.change).toEqual({ phosphate: 7.5 });
    // The policy tries potassium first, so the message speaks of it: raise K to 10 + 29.33 − 10 = 29.33 mEq.
    expect(r.problems[0]?.proposal?.text).toContain('raise potassium to 29.33 mEq');
    // 7.5 mmol of sodium phosphates = 2.5 mL, all 10 mEq of the sodium; potassium 10 as chloride.
    expect(ids(r)).toEqual(['sodium-phosphates-3', 'potassium-chloride-2']);
    expect(r.lines[0]?.volumeMl.toString()).toBe('2.5');
    expect(proposalAgain(json, r).problems).toEqual([]);
  });

  it('never brings potassium that was not ordered: auto skips potassium phosphates when K is absent', () => {
    const r = compound(orderJson({ per: 'day', Na: 100, phosphate: 15, anions: 'chloride' }, [AA15]));
    expect(r.problems).toEqual([]);
    expect(ids(r)).toEqual(['sodium-phosphates-3', 'sodium-chloride-4']);
    expect(r.delivered.K.toString()).toBe('0');
  });

  it('an explicit salt with no stock in the catalog is a named problem with the salt that fits', () => {
    const json = orderJson({ per: 'day', Na: 100, K: 60, phosphate: 10, phosphateSalt: 'organic', anions: 'chloride' }, [AA15]);
    const r = compound(json, without('sodium-glycerophosphate-1'));
    expect(codes(r)).toEqual(['no-stock']);
    expect(r.problems[0]?.path).toBe('ions.phosphateSalt');
    expect(r.problems[0]?.proposal?.change).toEqual({ phosphateSalt: 'potassium' });
    expect(proposalAgain(json, r, without('sodium-glycerophosphate-1')).problems).toEqual([]);
  });

  it('no phosphate stock at all: phosphate cannot be added', () => {
    const r = compound(orderJson({ per: 'day', Na: 100, K: 60, phosphate: 10, anions: 'chloride' }), without('sodium-glycerophosphate-1', 'sodium-phosphates-3', 'potassium-phosphates-3'));
    expect(codes(r)).toEqual(['no-stock']);
    expect(r.problems[0]?.ion).toBe('phosphate');
    expect(r.problems[0]?.proposal?.change).toEqual({ phosphate: 0 });
  });
});

describe('ordered below what the order\'s other lines already deliver', () => {
  it('sodium 20 mEq with 1000 mL of amino acids 10% (38 mEq Na): proposes 38 and adds no sodium salt', () => {
    const json = orderJson({ per: 'day', Na: 20, K: 40, anions: 'chloride' }, [{ product: 'amino-acids-10', amount: 100, unit: 'g' }]);
    const r = compound(json);
    expect(codes(r)).toEqual(['ordered-below-other-lines']);
    expect(r.problems[0]?.message).toContain('Amino acids 10% injection');
    expect(r.problems[0]?.proposal?.change).toEqual({ Na: 38 });
    expect(ids(r)).toEqual(['potassium-chloride-2']);
    expect(proposalAgain(json, r).problems).toEqual([]);
  });

  it('an ion the order does not name is none added, but what the amino acids bring of it is no problem', () => {
    // Sodium absent: amino acids 10% bring 38 mEq (1000 mL × 0.038) and no sodium salt is added.
    const lines = [{ product: 'amino-acids-10', amount: 100, unit: 'g' }];
    const absent = compound(orderJson({ per: 'day', K: 40, anions: 'chloride' }, lines));
    expect(absent.problems).toEqual([]);
    expect(ids(absent)).toEqual(['potassium-chloride-2']);
    expect(absent.delivered.Na.toString()).toBe('38');
    expect(absent.unordered).toContain('Na');
    // Sodium ordered as 0 is held to 0: the same bag is refused.
    expect(codes(compound(orderJson({ per: 'day', Na: 0, K: 40, anions: 'chloride' }, lines)))).toEqual(['ordered-below-other-lines']);
  });

  it('per kg: the proposal is per kg too, rounded up (1.995 mEq ÷ 1.5 kg = 1.33 mEq/kg)', () => {
    const r = compound({
      id: 'T-NEO', patient: { id: 'P', weightKg: '1.5', ageGroup: 'preterm-neonate' }, route: 'central', volumeMl: 225,
      lines: [{ product: 'amino-acids-10', amount: '3.5', unit: 'g/kg' }, { product: 'sterile-water', fill: true }],
      ions: { per: 'kg', Na: 1, anions: 'acetate' },
    });
    expect(codes(r)).toEqual(['ordered-below-other-lines']);
    // 3.5 g/kg × 1.5 kg = 5.25 g → 52.5 mL × 0.038 = 1.995 mEq Na = 1.33 mEq/kg.
    expect(r.problems[0]?.proposal?.change).toEqual({ Na: 1.33 });
  });
});

describe('anions the cations cannot carry', () => {
  it('acetate asked above what the cations allow', () => {
    const json = orderJson({ per: 'day', Na: 40, K: 20, anions: { acetate: 200 } }, [AA15]);
    const r = compound(json);
    // At most: 75.5 from the amino acids + 60 from every Na and K salt as acetate = 135.5 mEq.
    expect(codes(r)).toEqual(['acetate-above-cations']);
    expect(r.problems[0]?.proposal?.change).toEqual({ anions: { acetate: 135.5 } });
    expect(ids(r)).toEqual(['sodium-acetate-2', 'potassium-acetate-2']);
    expect(r.deliveredExact.acetate.toString()).toBe('135.5');
    expect(proposalAgain(json, r).problems).toEqual([]);
  });

  it('acetate asked below what the amino acids already bring', () => {
    const json = orderJson({ per: 'day', Na: 40, K: 20, anions: { acetate: 50 } }, [AA15]);
    const r = compound(json);
    expect(codes(r)).toEqual(['acetate-below-other-lines']);
    expect(r.problems[0]?.proposal?.change).toEqual({ anions: { acetate: 75.5 } });
    expect(ids(r)).toEqual(['sodium-chloride-4', 'potassium-chloride-2']);
    expect(proposalAgain(json, r).problems).toEqual([]);
  });

  it('chloride asked below what calcium chloride brings (policy that prefers calcium chloride)', () => {
    const policy = policyWith((p) => { ((p.compounding as Json).calciumSalts as Json).order = ['chloride', 'gluconate']; });
    const json = orderJson({ per: 'day', Na: 50, Ca: 10, anions: { chloride: 5 } });
    const r = compound(json, DEFAULT_CATALOG, policy);
    // Calcium chloride: 10 mEq ÷ 1.36 mEq/mL = 7.35 mL, bringing 10 mEq chloride.
    expect(ids(r)).toEqual(['calcium-chloride-10', 'sodium-acetate-2']);
    expect(codes(r)).toEqual(['chloride-below-other-lines']);
    expect(r.problems[0]?.proposal?.change).toEqual({ anions: { chloride: 10 } });
    expect(proposalAgain(json, r, DEFAULT_CATALOG, policy).problems).toEqual([]);
  });

  it('chloride asked above what the cations allow', () => {
    const json = orderJson({ per: 'day', Na: 50, anions: { chloride: 100 } });
    const r = compound(json);
    expect(codes(r)).toEqual(['chloride-above-cations']);
    expect(r.problems[0]?.proposal?.change).toEqual({ anions: { chloride: 50 } });
    expect(proposalAgain(json, r).problems).toEqual([]);
  });

  it('a balanced preference out of reach is a warning, met as nearly as the bag allows', () => {
    // 150 g of amino acids 15% = 1000 mL = 151 mEq acetate; only 20 mEq of Na to split:
    // x = (151 + 20) ÷ 2 = 85.5 > 20, so every salt goes as chloride (Cl 20 : acetate 151).
    const r = compound(orderJson({ per: 'day', Na: 20, anions: 'balanced' }, [{ product: 'amino-acids-15', amount: 150, unit: 'g' }]));
    expect(codes(r)).toEqual(['anion-ratio-unreachable']);
    expect(r.problems[0]?.severity).toBe('warn');
    expect(r.problems[0]?.proposal?.change).toEqual({ anions: 'chloride' });
    expect(r.feasible).toBe(true);
    expect(ids(r)).toEqual(['sodium-chloride-4']);
  });
});

describe('stock the catalog does not hold', () => {
  it('no magnesium sulfate', () => {
    const json = orderJson({ per: 'day', Mg: 12, Na: 40, anions: 'chloride' });
    const r = compound(json, without('magnesium-sulfate-50'));
    expect(codes(r)).toEqual(['no-stock']);
    expect(r.problems[0]?.ion).toBe('Mg');
    expect(r.problems[0]?.proposal?.change).toEqual({ Mg: 0 });
    expect(proposalAgain(json, r, without('magnesium-sulfate-50')).problems).toEqual([]);
  });

  it('no calcium gluconate, and calcium chloride not allowed by the policy: says so', () => {
    const r = compound(orderJson({ per: 'day', Ca: 10 }), without('calcium-gluconate-10'));
    expect(codes(r)).toEqual(['no-stock']);
    expect(r.problems[0]?.message).toContain('calcium chloride, which the policy does not allow');
    expect(r.lines).toEqual([]);
  });

  it('no potassium acetate under an acetate preference: potassium goes as chloride, with a warning', () => {
    const r = compound(orderJson({ per: 'day', Na: 40, K: 20, anions: 'acetate' }), without('potassium-acetate-2'));
    expect(codes(r)).toEqual(['no-stock']);
    expect(r.problems[0]?.severity).toBe('warn');
    // Chloride 20 (KCl) : acetate 40 (NaAc) = 0.5.
    expect(r.problems[0]?.proposal?.change).toEqual({ anions: { chlorideToAcetate: 0.5 } });
    expect(ids(r)).toEqual(['sodium-acetate-2', 'potassium-chloride-2']);
  });
});

describe('measurable volumes and policy', () => {
  it('flags a volume below the smallest measurable volume (0.1 mL in the shipped policy)', () => {
    // 0.2 mEq ÷ 4.06 mEq/mL = 0.0493 mL → 0.05 mL: measurable to 0.01 mL but below 0.1 mL.
    const r = compound(orderJson({ per: 'day', Mg: '0.2' }));
    expect(codes(r)).toEqual(['below-measurable-volume']);
    expect(r.problems[0]?.severity).toBe('warn');
    expect(r.lines[0]?.volumeMl.toString()).toBe('0.05');
    expect(r.feasible).toBe(true);
  });

  it('a volume that rounds to 0 mL is flagged and not added to the bag', () => {
    // 0.02 mEq ÷ 4.06 = 0.0049 mL → 0.00 mL.
    const r = compound(orderJson({ per: 'day', Mg: '0.02' }));
    expect(r.problems[0]?.message).toContain('rounds to 0 mL');
    expect(r.compounded.lines.some((l) => l.product.id === 'magnesium-sulfate-50')).toBe(false);
  });

  it('a policy without a compounding section allocates nothing and says why', () => {
    const policy = policyWith((p) => { delete p.compounding; });
    const r = compound(orderJson({ per: 'day', Na: 40 }), DEFAULT_CATALOG, policy);
    expect(codes(r)).toEqual(['no-compounding-policy']);
    expect(r.lines).toEqual([]);
    expect(r.feasible).toBe(false);
  });

  it('the amended targets of a proposal are themselves feasible (checked without display rounding)', () => {
    const parsed = parseOrder(orderJson({ per: 'day', Na: 5, K: 3, phosphate: 30, anions: { acetate: 500 } }, [AA15]), DEFAULT_CATALOG);
    if (!parsed.ok || !hasIons(parsed.value)) throw new Error('invalid');
    const r = compoundOrder(parsed.value, DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(codes(r)).toEqual(['phosphate-cation-exceeds-order', 'acetate-above-cations']);
    const amended = r.amended;
    if (!amended) throw new Error('no amended targets');
    const again = compoundTargets(parsed.value, amended, DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(again.problems.filter((p) => p.severity === 'block')).toEqual([]);
  });
});
