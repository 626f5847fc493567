import type { LabelModel } from './model.ts';
import { BarcodeSvg } from './BarcodeSvg.tsx';

/** The bag label, drawn from its model (black on white: label printers have no colour). */
export function LabelView({ model: m }: { model: LabelModel }) {
  return (
    <article className={`pr-label pr-size-${m.size.id}${m.compact ? ' pr-compact' : ''}`} aria-label="Bag label">
      <header className="pr-l-head">
        <span className="pr-l-inst">{m.institution}</span>
        <span className="pr-l-title">{m.title}</span>
      </header>
      {m.hold ? <p className="pr-l-hold">{m.hold}</p> : null}

      <section className="pr-l-patient" aria-label="Patient">
        <p className="pr-l-name">{m.patient.name}</p>
        <p>ID <strong>{m.patient.identifier}</strong> · {m.patient.location}</p>
        <p>Dosing weight <strong>{m.patient.weight}</strong> · {m.patient.ageGroup}</p>
      </section>

      <section className={m.route.emphatic ? 'pr-l-route pr-l-route-only' : 'pr-l-route'} aria-label="Route">
        <p className="pr-l-route-text">{m.route.text}</p>
        <p className="pr-l-route-detail">{m.route.detail}</p>
      </section>

      <section className="pr-l-ingredients" aria-label="Ingredients">
        <p className="pr-l-ing-head"><span>Ingredients</span><span>{m.perKg ? 'Per kg per day · per day' : 'Per day'}</span></p>
        <ul>
          {m.ingredients.map((i, n) => (
            <li key={n} className={n > 0 && m.ingredients[n - 1]?.group !== i.group ? 'pr-l-group' : undefined}>
              <span className="pr-l-ing-name">{i.name}{i.note ? <span className="pr-l-note"> {i.note}</span> : null}</span>
              <span className="pr-l-ing-amount">
                {i.perKg ? <span className="pr-l-perkg">{i.perKg}</span> : null}
                <strong>{i.perDay}</strong>
              </span>
            </li>
          ))}
        </ul>
      </section>

      <dl className="pr-l-volume">
        {m.volume.map((f) => <div key={f.label}><dt>{f.label}</dt><dd>{f.value}</dd></div>)}
      </dl>

      <section className="pr-l-dates" aria-label="Dates and storage">
        <p>Compounded <strong>{m.compounded}</strong></p>
        {m.beyondUseProblem ? <p className="pr-l-bud">Use by: {m.beyondUseProblem} <span className="pr-blank" /></p> : (
          <dl className="pr-l-bud">
            {m.beyondUse.map((b) => (
              <div key={b.condition}>
                <dt>Use by</dt>
                <dd><strong>{b.until}</strong> if {b.condition} ({b.duration}){b.after ? `, ${b.after}` : ''}</dd>
              </div>
            ))}
          </dl>
        )}
        <p>{m.storage}</p>
        <p className="pr-l-filter">{m.filter}</p>
      </section>

      <ul className="pr-l-cautions">{m.cautions.map((c) => <li key={c}>{c}</li>)}</ul>

      <footer className="pr-l-foot">
        <figure className="pr-l-code">
          {m.barcode ? <BarcodeSvg barcode={m.barcode} /> : <span className="pr-l-nocode">{m.barcodeProblem}</span>}
          <figcaption>Order {m.orderId}</figcaption>
        </figure>
        <p className="pr-l-verify">{m.verification}<span className="pr-blank" /></p>
      </footer>
    </article>
  );
}
