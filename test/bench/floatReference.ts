// The particle sum written outside the engine, for the benchmarks' "price of exact arithmetic": in plain
// binary floats and, line for line the same, in exact decimals (decimal.js at 28 digits, and the engine's
// own decimal at 15). All follow the exchange
// format's definition (osmolarity.particle = Σ volume × (Σ perMl + g/mL × mOsm/g) ÷ final volume; the
// label sum likewise with mOsmPerMl) and the engine's fill rule (the fill makes up the ordered volume).
import Decimal from 'decimal.js';
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

/** The decimal operations the exact sum needs: the engine's D and decimal.js both have them. */
interface Exact<T> {
  plus(y: T): T;
  minus(y: T): T;
  times(y: T): T;
  div(y: T): T;
  isZero(): boolean;
  gt(y: T): boolean;
}

/** decimal.js at 28 significant digits: the library the engine computed with before it had its own decimal. */
export const DecimalJs = Decimal.clone({ precision: 28, rounding: Decimal.ROUND_HALF_EVEN });
export type DecimalJs = InstanceType<typeof DecimalJs>;

/** The prepared order in decimal.js numbers. */
export function toDecimalJs(o: Prepared<D>): Prepared<DecimalJs> {
  const n = (d: D) => new DecimalJs(d.valueOf());
  return {
    volumeMl: n(o.volumeMl),
    lines: o.lines.map((l) => ({
      fill: l.fill, amount: n(l.amount), base: l.base, mmolPerMl: n(l.mmolPerMl), gramsPerMl: n(l.gramsPerMl),
      particlePerMl: n(l.particlePerMl), labelPerMl: n(l.labelPerMl), valence: n(l.valence),
    })),
  };
}

const max = <T extends Exact<T>>(a: T, b: T): T => (b.gt(a) ? b : a);

/** The same, line for line, in exact decimals (`zero` and `thousand` in the same type): what exactness alone costs. */
export function exactOsmolarity<T extends Exact<T>>(o: Prepared<T>, zero: T, thousand: T): { particle: T; label: T } {
  let added = zero;
  let particle = zero;
  let label = zero;
  let fill: Line<T> | null = null;
  for (const l of o.lines) {
    if (l.fill) { fill = l; continue; }
    let ml: T;
    switch (l.base) {
      case 'mL': ml = l.amount; break;
      case 'g': ml = l.amount.div(l.gramsPerMl); break;
      case 'mEq': ml = l.mmolPerMl.isZero() ? zero : l.amount.div(l.valence).div(l.mmolPerMl); break;
      case 'mmol': ml = l.mmolPerMl.isZero() ? zero : l.amount.div(l.mmolPerMl); break;
    }
    added = added.plus(ml);
    particle = particle.plus(ml.times(l.particlePerMl));
    label = label.plus(ml.times(l.labelPerMl));
  }
  let volume = added;
  if (fill) {
    const fillMl = max(o.volumeMl.minus(added), zero);
    particle = particle.plus(fillMl.times(fill.particlePerMl));
    label = label.plus(fillMl.times(fill.labelPerMl));
    volume = max(o.volumeMl, added);
  }
  return volume.isZero() ? { particle: zero, label: zero } : { particle: particle.div(volume).times(thousand), label: label.div(volume).times(thousand) };
}
