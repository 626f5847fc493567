// The particle sum written twice outside the engine, for the benchmarks' "price of exact arithmetic":
// once in plain binary floats and once, line for line the same, in decimal.js. Both follow the exchange
// format's definition (osmolarity.particle = Σ volume × (Σ perMl + g/mL × mOsm/g) ÷ final volume; the
// label sum likewise with mOsmPerMl) and the engine's fill rule (the fill makes up the ordered volume).
import { D, ZERO } from '../../src/core/decimal.ts';
import { SPECIES, type SpeciesId } from '../../src/core/species.ts';
import type { Catalog, Product } from '../../src/core/catalog.ts';
import type { GenOrder } from './generate.ts';

type Base = 'mL' | 'g' | 'mEq' | 'mmol';

/** One order line made ready for the sum: its stock's figures and the amount per bag (per-kg already multiplied). */
interface Line<N> { fill: boolean; amount: N; base: Base; mmolPerMl: N; gramsPerMl: N; particlePerMl: N; labelPerMl: N; valence: N }
/** An order made ready for the sum (outside the timing: this is parsing, not arithmetic). */
export interface Prepared<N> { volumeMl: N; lines: Line<N>[] }

function particlePerMl(p: Product): D {
  let sum = ZERO;
  for (const v of Object.values(p.perMl)) if (v) sum = sum.plus(v);
  return p.nutrient ? sum.plus(p.nutrient.gramsPerMl.times(p.nutrient.mOsmPerGram)) : sum;
}

/** Read a generated order against the catalog: each line's stock figures and its amount per bag. */
export function prepare(o: GenOrder, catalog: Catalog): Prepared<D> {
  const weight = new D(o.patient.weightKg);
  return {
    volumeMl: new D(o.volumeMl),
    lines: o.lines.map((l) => {
      const p = catalog.byId.get(l.product);
      if (!p) throw new Error(`bench order names an unknown stock ${l.product}`);
      const unit = l.unit ?? 'mL';
      const base = unit.replace('/kg', '') as Base;
      const species = (l.species ?? p.orderSpecies) as SpeciesId | null;
      const amount = l.amount === undefined ? ZERO : new D(l.amount).times(unit.endsWith('/kg') ? weight : 1);
      const particle = particlePerMl(p);
      return {
        fill: l.fill === true, amount, base,
        mmolPerMl: species ? (p.perMl[species] ?? ZERO) : ZERO,
        gramsPerMl: p.nutrient?.gramsPerMl ?? ZERO,
        particlePerMl: particle,
        labelPerMl: p.mOsmPerMl ?? particle,
        valence: new D(Math.abs(species ? (SPECIES[species].charge ?? 1) : 1) || 1),
      };
    }),
  };
}

/** The prepared order in binary floats (its own object shapes, so the float loop sees plain numbers only). */
export function toFloat(o: Prepared<D>): Prepared<number> {
  return {
    volumeMl: o.volumeMl.toNumber(),
    lines: o.lines.map((l) => ({
      fill: l.fill, amount: l.amount.toNumber(), base: l.base, mmolPerMl: l.mmolPerMl.toNumber(), gramsPerMl: l.gramsPerMl.toNumber(),
      particlePerMl: l.particlePerMl.toNumber(), labelPerMl: l.labelPerMl.toNumber(), valence: l.valence.toNumber(),
    })),
  };
}

/** Particle and label-sum osmolarity, mOsm/L, in binary floats. */
export function floatOsmolarity(o: Prepared<number>): { particle: number; label: number } {
  let added = 0;
  let particle = 0;
  let label = 0;
  let fill: Line<number> | null = null;
  for (const l of o.lines) {
    if (l.fill) { fill = l; continue; }
    let ml: number;
    switch (l.base) {
      case 'mL': ml = l.amount; break;
      case 'g': ml = l.amount / l.gramsPerMl; break;
      case 'mEq': ml = l.mmolPerMl === 0 ? 0 : l.amount / l.valence / l.mmolPerMl; break;
      case 'mmol': ml = l.mmolPerMl === 0 ? 0 : l.amount / l.mmolPerMl; break;
    }
    added += ml;
    particle += ml * l.particlePerMl;
    label += ml * l.labelPerMl;
  }
  let volume = added;
  if (fill) {
    const fillMl = Math.max(o.volumeMl - added, 0);
    particle += fillMl * fill.particlePerMl;
    label += fillMl * fill.labelPerMl;
    volume = Math.max(o.volumeMl, added);
  }
  return volume === 0 ? { particle: 0, label: 0 } : { particle: (particle / volume) * 1000, label: (label / volume) * 1000 };
}

const THOUSAND = new D(1000);

/** The same, line for line, in decimal.js: what exact arithmetic alone costs. */
export function decimalOsmolarity(o: Prepared<D>): { particle: D; label: D } {
  let added = ZERO;
  let particle = ZERO;
  let label = ZERO;
  let fill: Line<D> | null = null;
  for (const l of o.lines) {
    if (l.fill) { fill = l; continue; }
    let ml: D;
    switch (l.base) {
      case 'mL': ml = l.amount; break;
      case 'g': ml = l.amount.div(l.gramsPerMl); break;
      case 'mEq': ml = l.mmolPerMl.isZero() ? ZERO : l.amount.div(l.valence).div(l.mmolPerMl); break;
      case 'mmol': ml = l.mmolPerMl.isZero() ? ZERO : l.amount.div(l.mmolPerMl); break;
    }
    added = added.plus(ml);
    particle = particle.plus(ml.times(l.particlePerMl));
    label = label.plus(ml.times(l.labelPerMl));
  }
  let volume = added;
  if (fill) {
    const fillMl = D.max(o.volumeMl.minus(added), ZERO);
    particle = particle.plus(fillMl.times(fill.particlePerMl));
    label = label.plus(fillMl.times(fill.labelPerMl));
    volume = D.max(o.volumeMl, added);
  }
  return volume.isZero() ? { particle: ZERO, label: ZERO } : { particle: particle.div(volume).times(THOUSAND), label: label.div(volume).times(THOUSAND) };
}
