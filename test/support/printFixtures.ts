import { checkOrder } from '../../src/core/evaluate.ts';
import { parseCatalog, type Catalog } from '../../src/core/catalog.ts';
import type { Report } from '../../src/core/report.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY, DEMO_ORDERS } from '../../src/defaults.ts';
import { LABEL_PRESETS, type PrintOptions } from '../../src/ui/print/options.ts';

/** Print options of the demo scenario (Marren Point Hospital is fictional), times in UTC. */
export function printOptions(over: Partial<PrintOptions> = {}): PrintOptions {
  return {
    institution: 'Marren Point Hospital',
    paper: 'a4',
    labelSize: LABEL_PRESETS[0] ?? { id: '4x6', width: 4, height: 6, unit: 'in' },
    compoundedAt: new Date('2026-12-02T14:30:00Z'),
    printedAt: new Date('2026-12-02T13:05:00Z'),
    timeZone: 'UTC',
    catalog: DEFAULT_CATALOG,
    policy: DEFAULT_POLICY,
    ...over,
  };
}

/** The report of a demo order, by key (adult-peripheral, adult-central, preterm-neonate). */
export function demoReport(key: string): Report {
  const demo = DEMO_ORDERS.find((d) => d.key === key);
  if (!demo) throw new Error(`no demo order ${key}`);
  const r = checkOrder(demo.file, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value.report;
}

export const HOSTILE_PATIENT = '<script>alert("pt")</script> Smith & Jones';
export const HOSTILE_PRODUCT = 'Zinc <script>alert("x")</script> & copper injection';

/** The shipped catalog plus one additive whose name is markup, for escaping tests. */
export function hostileCatalog(): Catalog {
  const file = DEFAULT_FILES.catalog as { products: unknown[] };
  const r = parseCatalog({
    ...file,
    products: [...file.products, { id: 'zinc-hostile', name: HOSTILE_PRODUCT, role: 'additive', perMl: { Cl: '0.01' }, mOsmPerMl: '0.02' }],
  });
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

/** A hand-made order whose patient and one product carry markup and ampersands. */
export function hostileReport(catalog: Catalog = hostileCatalog()): Report {
  const r = checkOrder({
    id: 'MPH-2026-<&>',
    patient: { id: 'MRN-<b>1</b>&2', name: HOSTILE_PATIENT, location: 'Ward <i>7</i> & annex', weightKg: 60, ageGroup: 'adult' },
    route: 'central',
    volumeMl: 1500,
    lines: [
      { product: 'amino-acids-10', amount: 60, unit: 'g' },
      { product: 'dextrose-70', amount: 200, unit: 'g' },
      { product: 'zinc-hostile', amount: 2, unit: 'mL' },
      { product: 'sterile-water', fill: true },
    ],
  }, catalog, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value.report;
}

/**
 * The adult peripheral demo with dextrose raised to 250 g (user journey 2): over the peripheral
 * limit, so the engine holds it.
 */
export function heldReport(): Report {
  const demo = DEMO_ORDERS.find((d) => d.key === 'adult-peripheral');
  const file = structuredClone(demo?.file) as { lines: { product: string; amount?: number }[] };
  for (const l of file.lines) if (l.product === 'dextrose-70') l.amount = 250;
  const r = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value.report;
}
