import type { Report } from '../../core/report.ts';
import { predictedOsmolality } from '../reportExtras.ts';
import { show, showGap, showGrouped } from '../show.ts';

const WIDTH = 320;

/** Reported osmolarity, large, against the route's limit; both methods side by side; the rest as information. */
export function OsmolarityPanel({ report, stale }: { report: Report; stale: boolean }) {
  const o = report.osmolarity;
  const limit = o.peripheralLimit;
  const scaleMax = Math.max(limit ? limit * 1.6 : 1500, o.reported * 1.1, 100);
  const x = (v: number) => (WIDTH * Math.min(v, scaleMax)) / scaleMax;
  const over = limit !== null && o.reported > limit;
  const peripheral = report.route === 'peripheral';
  const predicted = predictedOsmolality(report);
  const info = report.information;
  return (
    <section className={`panel osm${stale ? ' stale' : ''}`} aria-labelledby="osm-title">
      <h2 id="osm-title">Osmolarity{stale ? <span className="stale-tag"> · last valid figures</span> : null}</h2>
      <p className="osm-figure">
        <output aria-label="Reported osmolarity" data-testid="reported-osmolarity">{show(o.reported, 1)}</output>
        <span className="unit"> mOsm/L</span>
      </p>
      <p className={`osm-against${over && peripheral ? ' over' : ''}`} data-testid="osmolarity-against">
        {limit === null
          ? 'No peripheral limit in the policy for this age group.'
          : over
            ? `${showGap(o.reported, limit, 1)} over the peripheral limit of ${showGrouped(limit, 0)} mOsm/L${peripheral ? '' : ' — central line ordered'}`
            : `${showGap(limit, o.reported, 1)} under the peripheral limit of ${showGrouped(limit, 0)} mOsm/L`}
      </p>
      {limit !== null ? (
        <svg className="gauge" viewBox={`0 0 ${WIDTH} 28`} width="100%" height="28" role="img" aria-label={`Reported ${show(o.reported, 1)} against the limit ${show(limit, 0)} mOsm/L`}>
          <rect x="0" y="8" width={WIDTH} height="12" className="gauge-track" />
          <rect x="0" y="8" width={x(o.reported)} height="12" className={over ? 'gauge-bar over' : 'gauge-bar'} />
          <line x1={x(limit)} x2={x(limit)} y1="2" y2="26" className="gauge-limit" />
        </svg>
      ) : null}
      <dl className="pairs two">
        <div><dt>Particle count</dt><dd>{show(o.particle, 1)} mOsm/L</dd></div>
        <div><dt>Label sum</dt><dd>{show(o.labelSum, 1)} mOsm/L</dd></div>
        <div><dt>Spread (label − particle)</dt><dd>{show(o.spread, 1)} mOsm/L</dd></div>
        <div><dt>Reported</dt><dd>{o.method === 'particle' ? 'particle count' : 'label sum'}, per policy</dd></div>
      </dl>
      {predicted ? (
        <div className="info predicted">
          <p><strong>Predicted osmolality (estimate, for information):</strong>{' '}
            {predicted.estimates.map((e) => `${show(e.value, 0)} ${e.unit} (${e.label.toLowerCase()})`).join('; ')}</p>
          <details>
            <summary>How far to trust it</summary>
            <ul>
              {predicted.estimates.map((e) => <li key={e.label}>{e.label}: {e.source}{e.status ? ` — ${e.status}` : ''}</li>)}
            </ul>
            {predicted.note ? <p>{predicted.note}</p> : null}
          </details>
        </div>
      ) : null}
      <p className="info">
        For information: ideal osmotic pressure ≈ {showGrouped(info.osmoticPressureMmHg, 0)} mmHg at {show(info.temperatureC, 0)} °C
        ({show(info.mmHgPerMOsmPerL, 2)} mmHg per mOsm/L, van ’t Hoff); {show(info.timesPlasma.low, 1)}–{show(info.timesPlasma.high, 1)} × plasma
        ({info.plasmaOsmolality.min}–{info.plasmaOsmolality.max} {info.plasmaOsmolality.unit}, {info.plasmaOsmolality.source}).
      </p>
    </section>
  );
}
