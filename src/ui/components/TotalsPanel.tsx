import type { Report } from '../../core/report.ts';
import { SPECIES, SPECIES_IDS } from '../../core/species.ts';
import { show, showOr } from '../show.ts';


/** What the bag delivers: final concentrations, energy, GIR and every species per litre, per day and per kg. */
export function TotalsPanel({ report, stale }: { report: Report; stale: boolean }) {
  const t = report.totals;
  return (
    <section className={`panel totals${stale ? ' stale' : ''}`} aria-labelledby="totals-title">
      <h2 id="totals-title">What the bag delivers{stale ? <span className="stale-tag"> · last valid figures</span> : null}</h2>
      <dl className="pairs two">
        <div><dt>Dextrose</dt><dd>{show(t.dextrosePercent, 2)}% · {show(t.grams.dextrose, 1)} g · {show(t.gramsPerKg.dextrose, 2)} g/kg</dd></div>
        <div><dt>Amino acids</dt><dd>{show(t.aminoAcidPercent, 2)}% · {show(t.grams.aminoAcids, 1)} g · {show(t.gramsPerKg.aminoAcids, 2)} g/kg</dd></div>
        <div><dt>Lipid</dt><dd>{show(t.lipidPercent, 2)}% · {show(t.grams.lipid, 1)} g · {show(t.gramsPerKg.lipid, 2)} g/kg</dd></div>
        <div><dt>Energy</dt><dd>{show(t.kcal.total, 0)} kcal · {show(t.kcalPerKg, 1)} kcal/kg</dd></div>
        <div><dt>Energy by source</dt><dd>dextrose {show(t.kcal.dextrose, 0)} · amino acids {show(t.kcal.aminoAcids, 0)} · lipid {show(t.kcal.lipid, 0)}{t.kcal.other > 0 ? ` · other ${show(t.kcal.other, 0)}` : ''} kcal</dd></div>
        <div><dt>Nitrogen · NPC:N</dt><dd>{show(t.nitrogenG, 2)} g · {showOr(t.npcToN, 0)}{t.npcToN === null ? '' : ' kcal/g N'}</dd></div>
        <div><dt>GIR</dt><dd>{show(t.girMgPerKgPerMin, 2)} mg/kg/min</dd></div>
        <div><dt>Fluid · rate</dt><dd>{show(t.fluidMlPerKg, 1)} mL/kg/day · {show(report.rateMlPerHour, 1)} mL/h over {show(report.hours, 0)} h</dd></div>
        <div><dt>Aluminum</dt><dd>{show(t.aluminumMcgPerKgPerDay, 2)} µg/kg/day (labelled maxima)</dd></div>
      </dl>
      <table className="species" aria-label="Electrolytes">
        <thead>
          <tr><th scope="col">Species</th><th scope="col" className="num">mmol/L</th><th scope="col" className="num">mEq/L</th><th scope="col" className="num">mmol/day</th><th scope="col" className="num">mmol/kg/day</th></tr>
        </thead>
        <tbody>
          {SPECIES_IDS.filter((s) => t.mmolPerDay[s] > 0).map((s) => (
            <tr key={s}>
              <th scope="row">{SPECIES[s].label}</th>
              <td className="num">{show(t.mmolPerL[s], 2)}</td>
              <td className="num">{SPECIES[s].charge === null ? 'mmol only' : SPECIES[s].charge === 0 ? '—' : show(t.mEqPerL[s], 2)}</td>
              <td className="num">{show(t.mmolPerDay[s], 2)}</td>
              <td className="num">{show(t.mmolPerKgPerDay[s], 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
