// The osmolality QA log: a measured osmolality recorded for a compounded bag (a saved order version),
// with the bag's calculated figures from the catalog and policy it was checked against.
import { z } from 'zod';
import { evaluateOrder } from '../../core/evaluate.ts';
import type { Report } from '../../core/report.ts';
import type { Result } from '../../core/problems.ts';
import { decimal, parseWith } from '../../core/schema.ts';
import type { CheckEnv } from '../check.ts';
import { read, write, type Store } from '../db.ts';
import { fileByHash } from '../files.ts';
import { QA_METHODS, type OrderVersion, type QaEntry } from '../types.ts';
import { validCatalogFile, validOrderFile, validPolicyFile } from '../validate.ts';
import { ageBandOf, calculatedFigures, systemOf } from './figures.ts';

/**
 * Plausible osmometer readings for a PN bag, mOsm/kg (plausibility bound, common practice: above any
 * compounded bag; the most concentrated stocks measure about 4,000–5,400 mOsm/kg).
 */
export const MEASURED_BOUNDS = { gt: 0, max: 6000 } as const;

function isCalendarDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return false;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3]);
}

const qaInputSchema = z.object({
  measured: decimal(MEASURED_BOUNDS),
  method: z.enum(QA_METHODS),
  instrument: z.string().trim().max(200, 'must be at most 200 characters'),
  measuredOn: z.string().refine(isCalendarDate, 'must be a date, YYYY-MM-DD'),
});

/** What the pharmacist types for a measurement (text, as in the form). */
export interface QaInput {
  measured: string;
  method: string;
  instrument: string;
  measuredOn: string;
}

/** The report of a saved version, from the catalog and policy it was checked against when they are known. */
export interface VersionReport {
  report: Report;
  /** `checked`: the catalog and policy of its check stamp; `current`: those were unknown, today's were used. */
  against: 'checked' | 'current';
}

/** Re-evaluate a saved version with the catalog and policy its stamp names (else the current ones). */
export async function reportOfVersion(store: Store, version: OrderVersion, current: CheckEnv): Promise<Result<VersionReport>> {
  const [catalogFile, policyFile] = await Promise.all([
    fileByHash(store, 'catalog', version.check.catalog.hash),
    fileByHash(store, 'policy', version.check.policy.hash),
  ]);
  const catalog = catalogFile ? validCatalogFile(catalogFile) : null;
  const policy = policyFile ? validPolicyFile(policyFile) : null;
  const known = catalog?.ok && policy?.ok;
  const cat = catalog?.ok ? catalog.value.value : current.catalog;
  const pol = policy?.ok ? policy.value.value : current.policy;
  const order = validOrderFile(version.file, known ? cat : current.catalog);
  if (!order.ok) return order;
  const evaluation = evaluateOrder(order.value.value, known ? cat : current.catalog, known ? pol : current.policy);
  return { ok: true, value: { report: evaluation.report, against: known ? 'checked' : 'current' } };
}

/**
 * Record a measured osmolality for a saved version. The input is validated (every problem listed);
 * the entry keeps the formula type and the calculated figures of `report`.
 */
export async function recordMeasurement(store: Store, input: QaInput, version: OrderVersion, report: Report, by: string | null): Promise<Result<QaEntry>> {
  const parsed = parseWith(qaInputSchema, input);
  if (!parsed.ok) return parsed;
  const entry: QaEntry = {
    id: store.newKey(),
    orderKey: version.orderKey,
    orderId: report.order,
    version: version.n,
    measured: parsed.value.measured.toString(),
    method: parsed.value.method,
    instrument: parsed.value.instrument,
    measuredOn: parsed.value.measuredOn,
    recordedAt: store.now(),
    recordedBy: by,
    ageBand: ageBandOf(report.patient.ageGroup),
    system: systemOf(report),
    calculated: calculatedFigures(report),
  };
  return write(store, ['qa'], async (tx) => {
    await tx.objectStore('qa').put(entry);
    return { ok: true, value: entry };
  });
}

/** Every QA entry. */
export async function listMeasurements(store: Store): Promise<Result<QaEntry[]>> {
  return read(() => store.db.getAll('qa'));
}

/** Remove a QA entry (a mistyped reading). */
export async function deleteMeasurement(store: Store, id: string): Promise<Result<void>> {
  return write(store, ['qa'], async (tx) => {
    await tx.objectStore('qa').delete(id);
    return { ok: true, value: undefined };
  });
}
