// What a QA entry keeps of the bag's report: its formula type and every calculated figure that a
// measured osmolality can be compared with.
import type { AgeGroup } from '../../core/order.ts';
import type { Report } from '../../core/report.ts';
import type { AgeBand, CalculatedFigure, System } from '../types.ts';

/** Adult / pediatric / neonatal, from the order's age group. */
export function ageBandOf(ageGroup: AgeGroup): AgeBand {
  switch (ageGroup) {
    case 'adult': return 'adult';
    case 'child': return 'pediatric';
    case 'term-neonate':
    case 'preterm-neonate': return 'neonatal';
  }
}

/** 3-in-1 when the bag holds lipid emulsion, else 2-in-1. */
export function systemOf(report: Pick<Report, 'lines'>): System {
  return report.lines.some((l) => l.role === 'lipid' && l.volumeMl > 0) ? '3-in-1' : '2-in-1';
}

/** The calculated figures of a report: particle count, label sum, and each predicted osmolality. */
export function calculatedFigures(report: Pick<Report, 'osmolarity' | 'information'>): CalculatedFigure[] {
  const out: CalculatedFigure[] = [
    { key: 'particle', label: 'Particle count', value: report.osmolarity.particle, unit: 'mOsm/L' },
    { key: 'labelSum', label: 'Label sum', value: report.osmolarity.labelSum, unit: 'mOsm/L' },
  ];
  // information.predictedOsmolality is absent for an empty bag.
  for (const e of report.information.predictedOsmolality?.estimates ?? []) {
    out.push({ key: `predicted:${e.method}`, label: `Predicted: ${e.label}`, value: e.value, unit: e.unit });
  }
  return out;
}
