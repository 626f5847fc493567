import catalogFile from '../data/catalog.json';
import policyFile from '../data/policy.json';
import adultPeripheral from '../data/demo/adult-peripheral.json';
import adultCentral from '../data/demo/adult-central.json';
import pretermNeonate from '../data/demo/preterm-neonate.json';
import adultIons from '../data/demo/adult-ions.json';
import { parseCatalog, type Catalog } from './core/catalog.ts';
import { parsePolicy, type Policy } from './core/policy.ts';
import { formatProblem } from './core/problems.ts';

/** The shipped files, as JSON (for export, reset and the catalog/policy views). */
export const DEFAULT_FILES = { catalog: catalogFile as unknown, policy: policyFile as unknown };

/** The demo orders of the invented scenario (Marren Point Hospital, fictional patients). */
export const DEMO_ORDERS: readonly { key: string; title: string; file: unknown }[] = [
  { key: 'adult-peripheral', title: 'Adult, peripheral 3-in-1', file: adultPeripheral },
  { key: 'adult-central', title: 'Adult, central 2-in-1', file: adultCentral },
  { key: 'preterm-neonate', title: 'Preterm neonate, central, per kg', file: pretermNeonate },
  { key: 'adult-ions', title: 'Adult, central, ions ordered (allocate salts)', file: adultIons },
];

function mustParse<T>(what: string, r: { ok: true; value: T } | { ok: false; problems: { path: string; message: string }[] }): T {
  if (r.ok) return r.value;
  // The shipped files are checked by the test suite; reaching this is a build defect, not user input.
  throw new Error(`shipped ${what} is invalid:\n${r.problems.map(formatProblem).join('\n')}`);
}

export const DEFAULT_CATALOG: Catalog = mustParse('catalog', parseCatalog(catalogFile));
export const DEFAULT_POLICY: Policy = mustParse('policy', parsePolicy(policyFile));
