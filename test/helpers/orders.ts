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
