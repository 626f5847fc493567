import { useId } from 'react';
import { AGE_GROUPS, ROUTES } from '../../core/order.ts';
import { headerValue, type HeaderField, type HeaderTextField } from '../order/draft.ts';
import { setHeader } from '../order/edits.ts';
import type { Workspace } from '../order/useOrderWorkspace.ts';
import { AGE_GROUP_TEXT, ROUTE_TEXT, show } from '../show.ts';
import { CellInput } from './CellInput.tsx';

const TEXT_FIELDS: { field: HeaderTextField; label: string; numeric?: boolean; suffix?: string; wide?: boolean }[] = [
  { field: 'id', label: 'Order ID' },
  { field: 'patient.id', label: 'Patient ID' },
  { field: 'patient.name', label: 'Patient name', wide: true },
  { field: 'patient.location', label: 'Location', wide: true },
  { field: 'patient.weightKg', label: 'Dosing weight', numeric: true, suffix: 'kg' },
  { field: 'volumeMl', label: 'Final volume', numeric: true, suffix: 'mL' },
  { field: 'hours', label: 'Infusion time', numeric: true, suffix: 'h' },
];

/** The order's identity and infusion plan, each field validated by the engine as it is typed. */
export function OrderHeader({ ws, highlighted, rate }: { ws: Workspace; highlighted: ReadonlySet<string>; rate: number | null }) {
  const ageId = useId();
  const order = ws.shown.order;
  const choose = (field: HeaderField, label: string, value: string) =>
    ws.actions.edit(`${label}: ${headerValue(ws.doc.order, field) || 'empty'} → ${value}`, (d) => setHeader(d, field, value));
  const errorsOf = (field: string) => ws.problems.at(field);
  const field = (f: (typeof TEXT_FIELDS)[number]) => (
    <CellInput
      key={f.field}
      label={f.label}
      visibleLabel
      className={f.wide ? 'wide' : f.numeric ? 'short' : 'mid'}
      numeric={f.numeric ?? false}
      {...(f.suffix ? { suffix: f.suffix } : {})}
      text={ws.pending?.cell === f.field ? ws.pending.text : headerValue(ws.doc.order, f.field)}
      errors={errorsOf(f.field)}
      highlighted={highlighted.has(f.field)}
      onType={(t) => ws.actions.type(f.field, t)}
      onCommit={() => ws.actions.commit(f.field, f.label)}
      onCancel={ws.actions.cancel}
    />
  );
  const routeErrors = errorsOf('route');
  const ageErrors = errorsOf('patient.ageGroup');
  return (
    <section className="order-header" aria-label="Order">
      {TEXT_FIELDS.slice(0, 4).map(field)}
      {field(TEXT_FIELDS[4]!)}
      <span className="field">
        <label htmlFor={ageId}>Age group</label>
        <select id={ageId} className={highlighted.has('patient.ageGroup') ? 'hl' : undefined} value={order.patient.ageGroup}
          aria-invalid={ageErrors.length > 0 || undefined}
          onChange={(e) => choose('patient.ageGroup', 'Age group', e.target.value)}>
          {AGE_GROUPS.includes(order.patient.ageGroup as never) ? null : <option value={order.patient.ageGroup}>choose…</option>}
          {AGE_GROUPS.map((a) => <option key={a} value={a}>{AGE_GROUP_TEXT[a]}</option>)}
        </select>
        {ageErrors.length > 0 ? <span className="error">{ageErrors.join('; ')}</span> : null}
      </span>
      <fieldset className={`field route${highlighted.has('route') ? ' hl' : ''}`}>
        <legend>Route</legend>
        <span className="radios">
          {ROUTES.map((r) => (
            <label key={r} className="radio">
              <input type="radio" name="route" value={r} checked={order.route === r} onChange={() => choose('route', 'Route', r)} />
              {ROUTE_TEXT[r]}
            </label>
          ))}
        </span>
        {routeErrors.length > 0 ? <span className="error">{routeErrors.join('; ')}</span> : null}
      </fieldset>
      {TEXT_FIELDS.slice(5).map(field)}
      <span className="field">
        <span className="label-text" id={`${ageId}-rate`}>Rate</span>
        <output className="rate" aria-labelledby={`${ageId}-rate`}>{rate === null ? '—' : `${show(rate, 1)} mL/h`}</output>
      </span>
    </section>
  );
}
