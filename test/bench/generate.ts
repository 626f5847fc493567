// Realistic generated PN orders for the benchmarks: adult and neonatal, 2-in-1 and 3-in-1, 10–40 lines,
// amounts that mostly fit their bag. Deterministic (a seeded generator), so every run benches the same orders.
// Dose ranges are common practice (from memory), used only to make plausible benchmark input.

/** A deterministic pseudo-random generator (mulberry32). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** One order line as the order file writes it; amounts are decimal strings. */
export interface GenLine {
  product: string;
  amount?: string;
  unit?: string;
  species?: string;
  fill?: true;
}

/** An order file as the generator writes it. */
export interface GenOrder {
  id: string;
  patient: { id: string; weightKg: string; ageGroup: 'adult' | 'term-neonate' | 'preterm-neonate' };
  route: 'peripheral' | 'central';
  volumeMl: string;
  hours: string;
  lines: GenLine[];
}

/** A whole number of hundredths as a decimal string (no float formatting on the way). */
function hundredths(n: number): string {
  const whole = Math.floor(n / 100);
  const cents = n % 100;
  return cents === 0 ? String(whole) : `${whole}.${String(cents).padStart(2, '0')}`;
}

/** A line with an amount held in hundredths until the order is written. */
interface Draft { product: string; cents: number; unit: string; species?: string; optional?: boolean; mlPerUnit: number }

const between = (rand: () => number, lo: number, hi: number) => lo + rand() * (hi - lo);

/**
 * Millilitres of stock per g, mEq or mmol ordered, for sizing the bag (catalog strengths: dextrose 70%
 * 0.7 g/mL, amino acids 10% 0.1 g/mL, etc.). Used only to pick a bag volume that mostly fits.
 */
const ML_PER = {
  'amino-acids-10': 10, 'amino-acids-15': 1 / 0.15, 'dextrose-70': 1 / 0.7, 'dextrose-50': 2, 'lipid-20': 5,
  'sodium-chloride-4': 0.25, 'sodium-acetate-2': 0.5, 'potassium-chloride-2': 0.5, 'potassium-acetate-2': 0.5,
  'potassium-phosphates-3': 1 / 3, 'sodium-glycerophosphate-1': 1, 'calcium-gluconate-10': 1 / 0.2325, 'magnesium-sulfate-50': 1 / 4.06,
  'multivitamin-adult': 1, 'trace-elements-adult': 1,
} as const;
type Stock = keyof typeof ML_PER;

function draft(product: Stock, amount: number, unit: string, extra: Partial<Draft> = {}): Draft {
  // An mL line is its own volume; calcium gluconate's figure is per mmol, and an mEq of calcium is half a mmol.
  const mlPerUnit = unit.startsWith('mL') ? 1 : ML_PER[product] * (product === 'calcium-gluconate-10' && unit.startsWith('mEq') ? 0.5 : 1);
  return { product, cents: Math.max(1, Math.round(amount * 100)), unit, mlPerUnit, ...extra };
}

/**
 * An adult day (doses per kg per day, common practice from memory, near the shipped policy's ranges):
 * amino acids 1–1.8 g/kg, energy about 20–30 kcal/kg, Na 0.9–1.5 mmol/kg added (the amino acids bring
 * some), K 1.1–1.7 mmol/kg, phosphate 20–35 mmol,
 * calcium 10.5–14.5 mEq, magnesium 8–16 mEq. Peripheral bags are weaker, as peripheral PN is.
 */
function adult(rand: () => number, w: number, peripheral: boolean, tna: boolean): Draft[] {
  const aa = w * (peripheral ? between(rand, 0.8, 1.2) : tna ? between(rand, 1.3, 1.8) : between(rand, 1, 1.8));
  const dextrose = w * (peripheral ? between(rand, 1.5, 2.5) : tna ? between(rand, 3.5, 4.5) : between(rand, 4, 5));
  const lines = [
    draft(peripheral || rand() < 0.2 ? 'amino-acids-10' : 'amino-acids-15', aa, 'g'),
    draft(peripheral || rand() < 0.85 ? 'dextrose-70' : 'dextrose-50', dextrose, 'g'),
  ];
  if (tna) lines.push(draft('lipid-20', w * between(rand, 0.7, 1) * 5, 'mL'));
  const phosphate = between(rand, 20, 35);
  const potassium = Math.max(5, w * between(rand, 1.1, 1.7) - phosphate * (4.4 / 3));
  const sodium = w * between(rand, 0.9, 1.5);
  lines.push(
    draft('sodium-chloride-4', sodium * 0.65, 'mEq'),
    draft('sodium-acetate-2', sodium * 0.35, 'mEq', { optional: true }),
    draft('potassium-chloride-2', potassium, 'mEq'),
    draft('potassium-phosphates-3', phosphate, 'mmol', { species: 'phosphate' }),
    draft('calcium-gluconate-10', between(rand, 10.5, 14.5), 'mEq'),
    draft('magnesium-sulfate-50', between(rand, 8, 16), 'mEq'),
    draft('multivitamin-adult', 10, 'mL', { optional: true }),
    draft('trace-elements-adult', 1, 'mL', { optional: true }),
  );
  return lines;
}

/**
 * A neonatal day per kg (common practice from memory): amino acids 2.5–3.5 g/kg (term 3), dextrose 8–14 g/kg,
 * organic phosphate 1–1.5 mmol/kg (it brings 2 mmol Na per mmol), calcium 1–2 mmol/kg, potassium
 * 2–3 mEq/kg, magnesium 0.2–0.5 mEq/kg; lipid in the bag only sometimes (often given separately).
 */
function neonate(rand: () => number, term: boolean, tna: boolean): Draft[] {
  const lines = [
    draft('amino-acids-10', between(rand, 2.5, term ? 3 : 3.5), 'g/kg'),
    draft('dextrose-50', tna ? between(rand, 8, 12) : between(rand, 11, 14), 'g/kg'),
  ];
  if (tna) lines.push(draft('lipid-20', between(rand, 1.5, 3) * 5, 'mL/kg'));
  lines.push(
    draft('sodium-glycerophosphate-1', between(rand, 1, 1.5), 'mmol/kg'),
    draft('calcium-gluconate-10', between(rand, 1, 2), 'mmol/kg', { species: 'Ca' }),
    draft('potassium-acetate-2', between(rand, 2, 3), 'mEq/kg'),
    draft('magnesium-sulfate-50', between(rand, 0.2, 0.5), 'mEq/kg'),
    draft('sodium-chloride-4', between(rand, 0.1, 0.3), 'mEq/kg', { optional: true }),
  );
  return lines;
}

/** Split a line's amount into two lines (as a split addition does) until the order has `n` lines. */
function splitTo(lines: Draft[], n: number, rand: () => number): Draft[] {
  const out = [...lines];
  while (out.length > n) {
    const i = out.findIndex((l) => l.optional);
    if (i === -1) break;
    out.splice(i, 1);
  }
  while (out.length < n) {
    const i = Math.floor(rand() * out.length);
    const l = out[i]!;
    if (l.cents < 2) continue;
    const part = Math.max(1, Math.floor(l.cents * between(rand, 0.2, 0.8)));
    out.splice(i, 1, { ...l, cents: part }, { ...l, cents: l.cents - part });
  }
  return out;
}

/**
 * One realistic order: 60% adult, 40% neonatal (most preterm); some peripheral; 3-in-1 for half the
 * adults and a few neonates; `lines` lines in all, the fill included. The bag volume follows the
 * fluid dose (adults 27–38 mL/kg, 3-in-1 at most 32; neonates 120–160 mL/kg) and holds what is ordered (about 3% are
 * ordered too small on purpose, as real mistakes are).
 */
export function makeOrder(rand: () => number, i: number, lineCount: number): GenOrder {
  const isAdult = rand() < 0.6;
  const ageGroup = isAdult ? 'adult' : rand() < 0.7 ? 'preterm-neonate' : 'term-neonate';
  const w = isAdult ? Math.round(between(rand, 45, 110) * 10) / 10 : ageGroup === 'preterm-neonate' ? Math.round(between(rand, 0.6, 2.2) * 100) / 100 : Math.round(between(rand, 2.5, 4.5) * 100) / 100;
  const peripheral = rand() < (isAdult ? 0.15 : 0.1);
  const tna = rand() < (isAdult ? 0.5 : 0.15);
  const drafts = splitTo(isAdult ? adult(rand, w, peripheral, tna) : neonate(rand, ageGroup === 'term-neonate', tna), lineCount - 1, rand);
  const perKg = (unit: string) => (unit.endsWith('/kg') ? w : 1);
  const needed = drafts.reduce((ml, l) => ml + (l.cents / 100) * perKg(l.unit) * l.mlPerUnit, 0);
  const wanted = w * (isAdult ? between(rand, 27, tna ? 32 : 38) : between(rand, 120, 160));
  const step = isAdult ? 100 : 1;
  const fits = Math.max(wanted, needed * between(rand, 1.02, 1.1));
  const volume = Math.ceil((rand() < 0.03 ? needed * 0.9 : fits) / step) * step;
  const lines: GenLine[] = drafts.map((d) => {
    const line: GenLine = { product: d.product, amount: hundredths(d.cents), unit: d.unit };
    if (d.species) line.species = d.species;
    return line;
  });
  lines.push({ product: 'sterile-water', fill: true });
  return {
    id: `GEN-${i}`,
    patient: { id: `P-${i}`, weightKg: String(w), ageGroup },
    route: peripheral ? 'peripheral' : 'central',
    volumeMl: String(volume),
    hours: '24',
    lines,
  };
}

/** The standard batch: order i has 10–40 lines. */
export function* batch(count: number, seed = 42): Generator<GenOrder> {
  const rand = rng(seed);
  for (let i = 0; i < count; i++) yield makeOrder(rand, i, 10 + Math.floor(rand() * 31));
}

/**
 * NDJSON text of orders `from`…`to - 1`, built as strings: a pool of generated order bodies is cycled and
 * only the id is written per line, so a million lines cost little more than their bytes.
 */
export function ndjsonChunk(pool: readonly string[], from: number, to: number): string {
  let text = '';
  for (let i = from; i < to; i++) text += `{"id":"S-${i}",${pool[i % pool.length]}\n`;
  return text;
}

/** Bodies for ndjsonChunk: each generated order as JSON without its leading `{` and id. */
export function ndjsonPool(size: number, seed = 7): string[] {
  const out: string[] = [];
  for (const o of batch(size, seed)) {
    const { id: _id, ...rest } = o;
    out.push(JSON.stringify(rest).slice(1));
  }
  return out;
}
