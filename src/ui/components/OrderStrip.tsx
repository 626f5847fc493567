import type { Report } from '../../core/report.ts';
import { AGE_GROUP_TEXT, show } from '../show.ts';

/** The order's identity and infusion plan in one dense strip. */
export function OrderStrip({ report }: { report: Report }) {
  const p = report.patient;
  const items: [string, string][] = [
    ['Order', report.order],
    ['Patient', `${p.name ?? '—'} · ${p.id}`],
    ['Location', p.location ?? '—'],
    ['Dosing weight', `${show(p.weightKg, p.weightKg < 10 ? 3 : 1)} kg`],
    ['Age group', AGE_GROUP_TEXT[p.ageGroup]],
    ['Route', report.route === 'central' ? 'Central line' : 'Peripheral line'],
    ['Final volume', `${show(report.volumeMl, 0)} mL`],
    ['Infusion', `${show(report.hours, 0)} h at ${show(report.rateMlPerHour, 1)} mL/h`],
  ];
  return (
    <dl className="order-strip" aria-label="Order details">
      {items.map(([k, v]) => (
        <div key={k}><dt>{k}</dt><dd>{v}</dd></div>
      ))}
    </dl>
  );
}
