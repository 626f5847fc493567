import type { Report } from '../../core/report.ts';
import { show } from '../show.ts';

const WIDTH = 320;

/** Reported osmolarity, large, against the route's limit; both methods side by side. */
export function OsmolarityPanel({ report }: { report: Report }) {
  const o = report.osmolarity;
  const limit = o.peripheralLimit;
  const scaleMax = Math.max(limit ? limit * 1.6 : 1500, o.reported * 1.1, 100);
  const x = (v: number) => (WIDTH * Math.min(v, scaleMax)) / scaleMax;
  const over = limit !== null && o.reported > limit;
  const margin = limit === null ? null : limit - o.reported;
  const peripheral = report.route === 'peripheral';
  return (
    <section className="panel osm" aria-labelledby="osm-title">
      <h2 id="osm-title">Osmolarity</h2>
      <p className="osm-figure">
        <output aria-label="Reported osmolarity" data-testid="reported-osmolarity">{show(o.reported, 1)}</output>
        <span className="unit"> mOsm/L</span>
      </p>
      <p className="osm-against">
        {limit === null
          ? 'No peripheral limit in the policy for this age group.'
          : over
            ? `${show(-margin!, 1)} over the peripheral limit of ${show(limit, 0)} mOsm/L${peripheral ? '' : ' — fine for the documented central line'}`
            : `${show(margin!, 1)} under the peripheral limit of ${show(limit, 0)} mOsm/L`}
      </p>
      {limit !== null ? (
        <svg className="gauge" width={WIDTH} height="28" role="img" aria-label={`Reported ${show(o.reported, 1)} against the limit ${show(limit, 0)} mOsm/L`}>
          <rect x="0" y="8" width={WIDTH} height="12" className="gauge-track" />
          <rect x="0" y="8" width={x(o.reported)} height="12" className={over ? 'gauge-bar over' : 'gauge-bar'} />
          <line x1={x(limit)} x2={x(limit)} y1="2" y2="26" className="gauge-limit" />
        </svg>
      ) : null}
      <dl className="pairs">
        <div><dt>Particle count</dt><dd>{show(o.particle, 1)} mOsm/L</dd></div>
        <div><dt>Label sum</dt><dd>{show(o.labelSum, 1)} mOsm/L</dd></div>
        <div><dt>Spread (label − particle)</dt><dd>{show(o.spread, 1)} mOsm/L</dd></div>
        <div><dt>Reported</dt><dd>{o.method === 'particle' ? 'particle count' : 'label sum'} (the higher, per policy)</dd></div>
      </dl>
      <p className="info">
        For information: ideal osmotic pressure ≈ {show(report.information.osmoticPressureMmHg, 0)} mmHg at {show(report.information.temperatureC, 0)} °C
        ({show(report.information.mmHgPerMOsmPerL, 2)} mmHg per mOsm/L, van ’t Hoff); {show(report.information.timesPlasma.low, 1)}–{show(report.information.timesPlasma.high, 1)} × plasma
        ({report.information.plasmaOsmolality.min}–{report.information.plasmaOsmolality.max} {report.information.plasmaOsmolality.unit}, {report.information.plasmaOsmolality.source}).
      </p>
    </section>
  );
}
