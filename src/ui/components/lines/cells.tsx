import { baseUnit, LINE_UNITS, type LineUnit } from '../../../core/order.ts';
import { moveLine, removeLine, setProduct, setSpecies, setUnit } from '../../order/edits.ts';
import { FILL, speciesChoices, unitChoices, type UnitChoice } from '../../order/lineUnits.ts';
import { linePath } from '../../order/problemIndex.ts';
import { lineCell } from '../../order/useOrderWorkspace.ts';
import { show, showAmount } from '../../show.ts';
import { CellInput } from '../CellInput.tsx';
import { ProductPicker } from './ProductPicker.tsx';
import { lineName, useLines, type LineRow } from './context.ts';

/** Grid position of a focusable cell (for arrow-key moves). */
export function gridAttrs(row: LineRow, col: string): Record<`data-${string}`, string | number> {
  return { 'data-row': row.index, 'data-col': col };
}

function Errors({ messages }: { messages: readonly string[] }) {
  return messages.length > 0 ? <span className="error">{messages.join('; ')}</span> : null;
}

export function ProductCell({ row }: { row: LineRow }) {
  const ctx = useLines();
  const name = (id: string) => ctx.catalog.byId.get(id)?.name ?? (id || 'none');
  return (
    <>
      <ProductPicker
        catalog={ctx.catalog}
        value={row.line.product}
        label={`Stock, line ${row.index + 1}`}
        errors={ctx.ws.problems.at(linePath(row.index, 'product'))}
        onPick={(id) => ctx.ws.edit(`Stock, line ${row.index + 1}: ${name(row.line.product)} → ${name(id)}`, (d) => setProduct(d, row.index, id, ctx.catalog))}
        grid={gridAttrs(row, 'product')}
      />
      <Errors messages={[...ctx.ws.problems.line(row.index), ...ctx.ws.problems.at(linePath(row.index, 'fill'))]} />
    </>
  );
}

export function AmountCell({ row }: { row: LineRow }) {
  const { ws, ...ctx } = useLines();
  if (row.line.fill) return <span className="fill-mark">to volume</span>;
  const cell = lineCell(row.key);
  const text = ws.pending?.cell === cell ? ws.pending.text : row.line.amount ?? '';
  return (
    <CellInput
      label={`Amount, ${lineName({ ws, ...ctx }, row)}`}
      text={text}
      numeric
      errors={ws.problems.at(linePath(row.index, 'amount'))}
      onType={(t) => ws.type(cell, t)}
      onCommit={() => ws.commit(cell, `Amount, line ${row.index + 1}: ${row.line.amount || 'empty'} → ${ws.pending?.text || 'empty'}`)}
      onCancel={ws.cancel}
      extra={gridAttrs(row, 'amount')}
    />
  );
}

export function UnitCell({ row }: { row: LineRow }) {
  const ctx = useLines();
  const product = ctx.catalog.byId.get(row.line.product);
  const choices: UnitChoice[] = [...unitChoices(product), FILL];
  const value = row.line.fill ? FILL : row.line.unit ?? '';
  const foreign = value !== '' && !choices.includes(value as UnitChoice);
  const errors = ctx.ws.problems.at(linePath(row.index, 'unit'));
  return (
    <span className="cell">
      <select aria-label={`Unit, ${lineName(ctx, row)}`} value={value} aria-invalid={errors.length > 0 || undefined}
        onChange={(e) => ctx.ws.edit(`Unit, line ${row.index + 1}: ${value || 'none'} → ${e.target.value}`, (d) => setUnit(d, row.index, e.target.value as UnitChoice, ctx.catalog))}
        {...gridAttrs(row, 'unit')}>
        {value === '' ? <option value="">unit…</option> : null}
        {foreign ? <option value={value}>{value} (not for this stock)</option> : null}
        {choices.map((u) => <option key={u} value={u}>{u === FILL ? 'fill (to volume)' : u}</option>)}
      </select>
      <Errors messages={errors} />
    </span>
  );
}

export function SpeciesCell({ row }: { row: LineRow }) {
  const ctx = useLines();
  const product = ctx.catalog.byId.get(row.line.product);
  const unit = row.line.unit ?? '';
  if (!product || row.line.fill || !(LINE_UNITS as readonly string[]).includes(unit)) return null;
  const base = baseUnit(unit as LineUnit);
  if (base !== 'mEq' && base !== 'mmol') return null;
  const choices: string[] = speciesChoices(product, base);
  const value = row.line.species ?? (product.orderSpecies && choices.includes(product.orderSpecies) ? product.orderSpecies : '');
  const errors = ctx.ws.problems.at(linePath(row.index, 'species'));
  const label = (s: string) => (s === 'glycerophosphate' ? 'organic P' : s);
  if (choices.length === 1 && value === choices[0] && errors.length === 0) return <span className="species-one">{label(value)}</span>;
  return (
    <span className="cell">
      <select aria-label={`Counted species, ${lineName(ctx, row)}`} value={value} aria-invalid={errors.length > 0 || undefined}
        onChange={(e) => ctx.ws.edit(`Species, line ${row.index + 1}: ${value || 'default'} → ${e.target.value}`, (d) => setSpecies(d, row.index, e.target.value))}
        {...gridAttrs(row, 'species')}>
        {value === '' || !choices.includes(value) ? <option value={value}>{value ? `${label(value)} (not in this stock)` : 'species…'}</option> : null}
        {choices.map((s) => <option key={s} value={s}>{label(s)}</option>)}
      </select>
      <Errors messages={errors} />
    </span>
  );
}

/** Per day and per kg per day, as the report states them. */
export function DoseCell({ row, per }: { row: LineRow; per: 'day' | 'kg' }) {
  const r = useLines().computed(row.key);
  const amount = per === 'day' ? r?.perDay : r?.perKgPerDay;
  if (!amount) return <span className="muted">—</span>;
  return <>{showAmount(amount.amount)} {amount.unit}</>;
}

/** A figure of the report line: stock volume, mOsm, share of the bag's particles. */
export function FigureCell({ row, figure }: { row: LineRow; figure: 'volumeMl' | 'mOsm' | 'sharePercent' }) {
  const r = useLines().computed(row.key);
  if (!r) return <span className="muted">—</span>;
  if (figure === 'volumeMl') return <>{show(r.volumeMl, 2)}</>;
  if (figure === 'mOsm') return <>{show(r.mOsm, 1)}</>;
  return <>{show(r.sharePercent, 1)}%</>;
}

export function MoveCell({ row }: { row: LineRow }) {
  const ctx = useLines();
  const name = lineName(ctx, row);
  return (
    <span className="move">
      <span className="n">{row.index + 1}</span>
      <button type="button" className="icon" aria-label={`Move up, ${name}`} disabled={row.index === 0}
        onClick={() => ctx.ws.edit(`Move line ${row.index + 1} up`, (d) => moveLine(d, row.index, -1))} {...gridAttrs(row, 'up')}>↑</button>
      <button type="button" className="icon" aria-label={`Move down, ${name}`} disabled={row.index === ctx.lineCount - 1}
        onClick={() => ctx.ws.edit(`Move line ${row.index + 1} down`, (d) => moveLine(d, row.index, 1))} {...gridAttrs(row, 'down')}>↓</button>
    </span>
  );
}

export function RemoveCell({ row }: { row: LineRow }) {
  const ctx = useLines();
  return (
    <button type="button" className="icon remove" aria-label={`Remove ${lineName(ctx, row)}`}
      onClick={() => ctx.ws.edit(`Remove ${lineName(ctx, row)}`, (d) => removeLine(d, row.index))} {...gridAttrs(row, 'remove')}>×</button>
  );
}
