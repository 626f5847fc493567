// What the browser keeps: saved orders with every version, the open draft, the catalog and policy in
// force, every catalog and policy an order was checked against, and the osmolality QA log.
import type { Verdict } from '../core/findings.ts';
import type { FileKind } from './restore.ts';

/** A JSON object as a file holds it. */
export type JsonObject = Record<string, unknown>;

/** Which catalog or policy: its id and the SHA-256 of its content (canonical JSON). */
export interface FileRef {
  id: string;
  hash: string;
}

/** The result of checking one version: verdict (null when the order did not validate) and against what. */
export interface CheckStamp {
  verdict: Verdict | null;
  /** How many problems kept the order from being checked (0 when it checked). */
  problems: number;
  catalog: FileRef;
  policy: FileRef;
  checkedAt: string;
}

/** "Verified by": initials and time. A signed version is locked for good. */
export interface SignOff {
  by: string;
  at: string;
}

/** How a version came to be. */
export type VersionOrigin = 'saved' | 'imported' | 'copied';

/** One saved state of an order: the v1 order file as it was, who saved it, what the check said. */
export interface OrderVersion {
  orderKey: string;
  /** 1, 2, 3… in the order they were saved. */
  n: number;
  file: JsonObject;
  savedAt: string;
  /** Initials of whoever saved it, when known. */
  savedBy: string | null;
  origin: VersionOrigin;
  check: CheckStamp;
  signOff: SignOff | null;
}

/** The summary row of a saved order (what the list shows and searches). */
export interface OrderRecord {
  /** Stable storage key (the order id can be edited; this never changes). */
  key: string;
  orderId: string;
  patientId: string;
  patientName: string | null;
  ageGroup: string | null;
  route: string | null;
  createdAt: string;
  updatedAt: string;
  /** Number of the latest version. */
  latest: number;
  /** The latest version's verdict (null: it did not validate). */
  verdict: Verdict | null;
  /** Sign-off of the latest version, if it is signed. */
  signOff: SignOff | null;
  /** The order this one was copied from (next day's bag). */
  copiedFrom: { key: string; orderId: string; n: number } | null;
}

/** The open order's working copy: autosaved on every committed edit, restored on load. */
export interface Draft {
  slot: 'open';
  /** The saved order it belongs to (null: not saved yet). */
  orderKey: string | null;
  /** The version it started from. */
  baseVersion: number | null;
  /** The order file as edited (may be incomplete or invalid: it is work in progress). */
  file: JsonObject;
  editedAt: string;
  editedBy: string | null;
}

/** Where the catalog or policy in force came from. */
export type FileOrigin = 'edited' | 'imported';

/** The catalog or policy in force, when it is not the shipped default. */
export interface ActiveFile {
  kind: Exclude<FileKind, 'order'>;
  file: JsonObject;
  ref: FileRef;
  savedAt: string;
  origin: FileOrigin;
}

/** Every catalog and policy that was ever in force, by content hash (orders point at them). */
export interface LibraryEntry {
  hash: string;
  kind: Exclude<FileKind, 'order'>;
  id: string;
  file: JsonObject;
  firstUsed: string;
}

/** How an osmolality was measured. */
export const QA_METHODS = ['freezing-point', 'vapour-pressure', 'other'] as const;
export type QaMethod = (typeof QA_METHODS)[number];

/** The age band of a formula for the QA statistics. */
export const AGE_BANDS = ['adult', 'pediatric', 'neonatal'] as const;
export type AgeBand = (typeof AGE_BANDS)[number];
/** 2-in-1 (no lipid in the bag) or 3-in-1 (lipid in the bag). */
export const SYSTEMS = ['2-in-1', '3-in-1'] as const;
export type System = (typeof SYSTEMS)[number];

/** One calculated figure of a bag, as the report gave it. */
export interface CalculatedFigure {
  /** `particle`, `labelSum`, or `predicted:<method>`. */
  key: string;
  label: string;
  value: number;
  unit: string;
}

/** A measured osmolality of a compounded bag, with the bag's calculated figures at the time. */
export interface QaEntry {
  id: string;
  orderKey: string;
  orderId: string;
  version: number;
  /** mOsm/kg, as typed (decimal text). */
  measured: string;
  method: QaMethod;
  instrument: string;
  /** Date of the measurement, YYYY-MM-DD. */
  measuredOn: string;
  recordedAt: string;
  recordedBy: string | null;
  ageBand: AgeBand;
  system: System;
  calculated: CalculatedFigure[];
}
