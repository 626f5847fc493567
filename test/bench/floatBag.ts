// The engine's whole bag computation written again in binary floats, for the benchmarks' like-for-like
// "price of exact arithmetic": the same figures computeBag works out (each line's volume, particles,
// label mOsm, kcal and aluminum; every species; grams, kcal by source, nitrogen, NPC:N, GIR, both
// osmolarities, osmotic pressure, aluminum per kg), by the same rules, from the same validated order, with
// a line object per line as the engine makes. The order is read into plain numbers beforehand (outside the
// timing, as parsing is): only the arithmetic and the bag's own objects are timed.
import { SPECIES_IDS, SPECIES, type SpeciesId } from '../../src/core/species.ts';
import type { Order } from '../../src/core/order.ts';
import type { Policy } from '../../src/core/policy.ts';
import type { Role } from '../../src/core/catalog.ts';
import { mmHgPerMOsmPerL } from '../../src/core/compute/bag.ts';

type Base = 'mL' | 'g' | 'mEq' | 'mmol';

/** An order line's figures as plain numbers. */
interface FloatLine {
  fill: boolean;
  amount: number;
  perKg: boolean;
  base: Base;
  /** mmol/mL of the species an mEq or mmol line counts (0 when the stock has none), and its valence. */
  orderPerMl: number;
  valence: number;
  role: Role;
  gramsPerMl: number;
  particlePerMl: number;
  /** The labelled mOsm/mL, or NaN when the stock has none (the particle figure stands in). */
  labelPerMl: number;
  kcalPerMl: number;
  aluminumPerMl: number;
  /** Species indices (SPECIES_IDS order) and their mmol/mL, side by side. */
  species: Int32Array;
  perMl: Float64Array;
}

/** A validated order as plain numbers. */
export interface FloatOrder {
  weightKg: number;
  volumeMl: number | null;
  hours: number;
  lines: FloatLine[];
  reported: Policy['reportedOsmolarity'];
  gramsPerGramNitrogen: number;
  mmHgPerMOsmPerL: number;
}

/** One line of the float bag. */
export interface FloatBagLine { volumeMl: number; inBag: boolean; particleMOsm: number; labelMOsm: number; kcal: number; aluminumMcg: number }

/** The float bag: the figures computeBag's Bag holds. */
export interface FloatBag {
  lines: FloatBagLine[];
  finalVolumeMl: number;
  addedVolumeMl: number;
  rateMlPerHour: number;
  speciesMmol: Float64Array;
  grams: { dextrose: number; aminoAcids: number; lipid: number };
  percent: { dextrose: number; aminoAcids: number; lipid: number };
  kcal: { dextrose: number; aminoAcids: number; lipid: number; other: number; total: number; nonProtein: number };
  nitrogenG: number;
  npcToN: number | null;
  girMgPerKgPerMin: number;
  osmolarity: { particle: number; labelSum: number; reported: number; method: 'particle' | 'labelSum' };
  osmoticPressureMmHg: number;
  aluminumMcg: number;
  aluminumMcgPerKgPerDay: number;
}

const valenceOf = (s: SpeciesId | null) => Math.abs((s ? SPECIES[s].charge : null) ?? 1) || 1;

/** Read a validated order (and the policy's reference figures) into plain numbers. */
export function toFloatOrder(order: Order, policy: Policy): FloatOrder {
  return {
    weightKg: order.patient.weightKg.toNumber(),
    volumeMl: order.volumeMl ? order.volumeMl.toNumber() : null,
    hours: order.hours.toNumber(),
    reported: policy.reportedOsmolarity,
    gramsPerGramNitrogen: policy.reference.gramsAminoAcidPerGramNitrogen.value.toNumber(),
    mmHgPerMOsmPerL: mmHgPerMOsmPerL(policy.reference.osmoticPressureTemperatureC.value).toNumber(),
    lines: order.lines.map((line) => {
      const p = line.product;
      const held = (Object.keys(p.perMl) as SpeciesId[]).filter((s) => p.perMl[s]);
      const n = p.nutrient;
      const amount = line.kind === 'amount' ? line.amount.toNumber() : 0;
      const unit = line.kind === 'amount' ? line.unit : 'mL';
      const species = line.kind === 'amount' ? line.species : null;
      const kcalPerMl = p.kcalPerMl ?? (n?.kcalPerGram ? n.kcalPerGram.times(n.gramsPerMl) : null);
      return {
        fill: line.kind === 'fill', amount, perKg: unit.endsWith('/kg'), base: unit.replace('/kg', '') as Base,
        orderPerMl: species ? (p.perMl[species]?.toNumber() ?? 0) : 0, valence: valenceOf(species), role: p.role,
        gramsPerMl: n ? n.gramsPerMl.toNumber() : 0,
        particlePerMl: p.particlePerMl.toNumber(),
        labelPerMl: p.mOsmPerMl ? p.mOsmPerMl.toNumber() : NaN,
        kcalPerMl: kcalPerMl ? kcalPerMl.toNumber() : 0,
        aluminumPerMl: p.aluminumMcgPerL ? p.aluminumMcgPerL.toNumber() / 1000 : 0,
        species: Int32Array.from(held, (s) => SPECIES_IDS.indexOf(s)),
        perMl: Float64Array.from(held, (s) => p.perMl[s]!.toNumber()),
      };
    }),
  };
}

function lineOf(l: FloatLine, volumeMl: number): FloatBagLine {
  const particleMOsm = l.particlePerMl * volumeMl;
  return {
    volumeMl, inBag: volumeMl > 0, particleMOsm,
    labelMOsm: l.labelPerMl === l.labelPerMl ? l.labelPerMl * volumeMl : particleMOsm,
    kcal: l.kcalPerMl * volumeMl, aluminumMcg: l.aluminumPerMl * volumeMl,
  };
}

function volumeOf(l: FloatLine, weightKg: number): number {
  const amount = l.perKg ? l.amount * weightKg : l.amount;
  switch (l.base) {
    case 'mL': return amount;
    case 'g': return l.gramsPerMl === 0 ? 0 : amount / l.gramsPerMl;
    case 'mEq': return l.orderPerMl === 0 ? 0 : amount / l.valence / l.orderPerMl;
    case 'mmol': return l.orderPerMl === 0 ? 0 : amount / l.orderPerMl;
  }
}

const perLitre = (x: number, volumeMl: number) => (volumeMl === 0 ? 0 : (x / volumeMl) * 1000);
const percentOf = (g: number, volumeMl: number) => (volumeMl === 0 ? 0 : (g / volumeMl) * 100);

/** computeBag's figures in binary floats. */
export function floatBag(o: FloatOrder): FloatBag {
  const lines: FloatBagLine[] = [];
  let fill: FloatLine | null = null;
  let fillAt = 0;
  let added = 0;
  for (const l of o.lines) {
    if (l.fill) { fill = l; fillAt = lines.length; continue; }
    const line = lineOf(l, volumeOf(l, o.weightKg));
    added += line.volumeMl;
    lines.push(line);
  }
  let finalVolumeMl = added;
  let all = o.lines;
  if (fill && o.volumeMl !== null) {
    lines.splice(fillAt, 0, lineOf(fill, Math.max(o.volumeMl - added, 0)));
    finalVolumeMl = Math.max(o.volumeMl, added);
  } else if (fill) {
    all = o.lines.filter((l) => !l.fill);
  }
  const mmol = new Float64Array(SPECIES_IDS.length);
  let dextroseG = 0, aminoAcidsG = 0, lipidG = 0;
  let dextroseKcal = 0, aminoAcidsKcal = 0, lipidKcal = 0, otherKcal = 0;
  let particle = 0, label = 0, aluminum = 0;
  for (let i = 0; i < lines.length; i++) {
    const b = lines[i]!;
    const l = all[i]!;
    const v = b.volumeMl;
    for (let j = 0; j < l.species.length; j++) mmol[l.species[j]!]! += l.perMl[j]! * v;
    const g = l.gramsPerMl * v;
    if (l.role === 'dextrose') { dextroseG += g; dextroseKcal += b.kcal; }
    else if (l.role === 'amino-acids') { aminoAcidsG += g; aminoAcidsKcal += b.kcal; }
    else if (l.role === 'lipid') { lipidG += g; lipidKcal += b.kcal; }
    else otherKcal += b.kcal;
    particle += b.particleMOsm;
    label += b.labelMOsm;
    aluminum += b.aluminumMcg;
  }
  const particleOsm = perLitre(particle, finalVolumeMl);
  const labelOsm = perLitre(label, finalVolumeMl);
  const method = o.reported === 'higher' ? (labelOsm > particleOsm ? 'labelSum' : 'particle') : o.reported;
  const reported = method === 'particle' ? particleOsm : labelOsm;
  const nitrogenG = aminoAcidsG / o.gramsPerGramNitrogen;
  const nonProtein = dextroseKcal + lipidKcal;
  return {
    lines, finalVolumeMl, addedVolumeMl: added, rateMlPerHour: finalVolumeMl / o.hours, speciesMmol: mmol,
    grams: { dextrose: dextroseG, aminoAcids: aminoAcidsG, lipid: lipidG },
    percent: { dextrose: percentOf(dextroseG, finalVolumeMl), aminoAcids: percentOf(aminoAcidsG, finalVolumeMl), lipid: percentOf(lipidG, finalVolumeMl) },
    kcal: { dextrose: dextroseKcal, aminoAcids: aminoAcidsKcal, lipid: lipidKcal, other: otherKcal, total: dextroseKcal + aminoAcidsKcal + lipidKcal + otherKcal, nonProtein },
    nitrogenG,
    npcToN: nitrogenG === 0 ? null : nonProtein / nitrogenG,
    girMgPerKgPerMin: (dextroseG * 1000) / (o.weightKg * o.hours * 60),
    osmolarity: { particle: particleOsm, labelSum: labelOsm, reported, method },
    osmoticPressureMmHg: reported * o.mmHgPerMOsmPerL,
    aluminumMcg: aluminum,
    aluminumMcgPerKgPerDay: aluminum / o.weightKg,
  };
}
