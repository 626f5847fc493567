// Test helpers: build orders, bags and policies from plain JSON against the shipped catalog and policy.
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY } from '../../src/defaults.ts';
import { parseOrder, type AgeGroup, type Order, type OrderInput, type Route } from '../../src/core/order.ts';
import { parsePolicy, type Policy, type policyFileSchema } from '../../src/core/policy.ts';
import type { z } from 'zod';
import { computeBag, type Bag } from '../../src/core/compute/bag.ts';
import { evaluateOrder, type Evaluation } from '../../src/core/evaluate.ts';
import { formatProblem } from '../../src/core/problems.ts';
import type { Catalog } from '../../src/core/catalog.ts';
import type { Finding } from '../../src/core/findings.ts';

export interface OrderSpec {
  age: AgeGroup;
  route?: Route;
  weightKg: number | string;
  volumeMl?: number | string;
  hours?: number | string;
  lines: OrderInput['lines'];
}

/** The order JSON for a spec (id and patient filled in). */
export function orderJson(spec: OrderSpec): OrderInput {
  const json: OrderInput = {
    id: 'TEST-1',
    patient: { id: 'P-1', weightKg: spec.weightKg, ageGroup: spec.age },
    route: spec.route ?? 'central',
    lines: spec.lines,
  };
  if (spec.volumeMl !== undefined) json.volumeMl = spec.volumeMl;
  if (spec.hours !== undefined) json.hours = spec.hours;
  return json;
}

/** A validated order; a test spec that does not validate is a broken test, so it throws. */
export function orderOf(spec: OrderSpec, catalog: Catalog = DEFAULT_CATALOG): Order {
  const r = parseOrder(orderJson(spec), catalog);
  if (!r.ok) throw new Error(`test order is invalid:\n${r.problems.map(formatProblem).join('\n')}`);
  return r.value;
}

export function bagOf(spec: OrderSpec, policy: Policy = DEFAULT_POLICY, catalog: Catalog = DEFAULT_CATALOG): Bag {
  return computeBag(orderOf(spec, catalog), policy);
}

export function evaluate(spec: OrderSpec, policy: Policy = DEFAULT_POLICY, catalog: Catalog = DEFAULT_CATALOG): Evaluation {
  return evaluateOrder(orderOf(spec, catalog), catalog, policy);
}

/** The policy file as JSON (before validation). */
export type PolicyJson = z.input<typeof policyFileSchema>;

/** A copy of the shipped policy JSON, for a test to edit. */
export function policyJson(): PolicyJson {
  return structuredClone(DEFAULT_FILES.policy) as PolicyJson;
}

/** The shipped policy with an edit applied to its JSON; throws if the edit makes it invalid. */
export function policyWith(edit: (json: PolicyJson) => void): Policy {
  const json = policyJson();
  edit(json);
  const r = parsePolicy(json);
  if (!r.ok) throw new Error(`test policy is invalid:\n${r.problems.map(formatProblem).join('\n')}`);
  return r.value;
}

/** Findings of one code (and, when given, one screen or nutrient). */
export function pick(findings: readonly Finding[], code: Finding['code'], by: { screen?: string; nutrient?: string } = {}): Finding[] {
  return findings.filter((f) => f.code === code && (by.screen === undefined || f.screen === by.screen) && (by.nutrient === undefined || f.nutrient === by.nutrient));
}

/** The single finding of a code/screen/nutrient; throws when there is not exactly one. */
export function one(findings: readonly Finding[], code: Finding['code'], by: { screen?: string; nutrient?: string } = {}): Finding {
  const found = pick(findings, code, by);
  if (found.length !== 1) throw new Error(`expected one ${code} ${JSON.stringify(by)} finding, got ${found.length}`);
  return found[0] as Finding;
}

export const AGES: readonly AgeGroup[] = ['adult', 'child', 'term-neonate', 'preterm-neonate'];

/**
 * The adult peripheral 3-in-1 demo with dextrose raised to 250 g: the solver tests' held bag. With
 * the catalog's label values (dextrose 70% 3532 mOsm/L, amino acids 10% 840, lipid emulsion 20% 260,
 * sodium chloride 23.4% 8008, potassium chloride 4000, potassium phosphates 7.4/mL, magnesium sulfate
 * 4060, calcium gluconate 680, multivitamin 4.11/mL, trace elements 0.36/mL) the label sum is
 * 2298.6 mOsm: 1149.3 mOsm/L in 2000 mL, over ASPEN 2014's 900.
 */
export const HELD_ADULT_PERIPHERAL: OrderSpec = {
  age: 'adult', route: 'peripheral', weightKg: 68, volumeMl: 2000, hours: 24,
  lines: [
    { product: 'amino-acids-10', amount: 80, unit: 'g' },
    { product: 'dextrose-70', amount: 250, unit: 'g' },
    { product: 'lipid-20', amount: 250, unit: 'mL' },
    { product: 'sodium-chloride-4', amount: 60, unit: 'mEq' },
    { product: 'potassium-chloride-2', amount: 40, unit: 'mEq' },
    { product: 'potassium-phosphates-3', amount: 15, unit: 'mmol', species: 'phosphate' },
    { product: 'magnesium-sulfate-50', amount: 8, unit: 'mEq' },
    { product: 'calcium-gluconate-10', amount: '9.3', unit: 'mEq' },
    { product: 'multivitamin-adult', amount: 10, unit: 'mL' },
    { product: 'trace-elements-adult', amount: 1, unit: 'mL' },
    { product: 'sterile-water', fill: true },
  ],
};

/** True when an order fails the peripheral osmolarity screen of the shipped policy. */
export function osmolarityFails(order: Order): boolean {
  return evaluateOrder(order, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false }).findings.some((f) => f.code === 'osmolarity-peripheral');
}
