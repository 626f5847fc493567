import { memo } from 'react';
import { baseUnit, LINE_UNITS, type LineUnit } from '../../../core/order.ts';
import type { DraftLine } from '../../order/draft.ts';
import { moveLine, removeLine, setProduct, setSpecies, setUnit } from '../../order/edits.ts';
import { FILL, speciesChoices, unitChoices, type UnitChoice } from '../../order/lineUnits.ts';
import { lineCell } from '../../order/useOrderWorkspace.ts';
import { show, showAmount } from '../../show.ts';
import { CellInput } from '../CellInput.tsx';
import { ProductPicker } from './ProductPicker.tsx';
import { useLines, type LineRow } from './context.ts';

// Input cells are memoized on plain props (the line object is kept when a line is not edited), so a
// keystroke re-renders only the cell typed into and the figures.

type Grid = Record<`data-${string}`, string | number>;
const grid = (index: number, col: string): Grid => ({ 'data-row': index, 'data-col': col });
const list = (error: string): string[] => (error ? [error] : []);

function Errors({ error }: { error: string }) {
  return error ? <span className="error">{error}</span> : null;
}

export const ProductCell = memo(function ProductCell({ index, product, error }: { index: number; product: string; error: string }) {
  const { actions, catalog } = useLines();
  const name = (id: string) => catalog.byId.get(id)?.name ?? (id || 'none');
  return (
    <ProductPicker
      catalog={catalog}
      value={product}
      label={`Stock, line ${index + 1}`}
      errors={list(error)}
      onPick={(id) => actions.edit(`Stock, line ${index + 1}: ${name(product)} → ${name(id)}`, (d) => setProduct(d, index, id, catalog))}
      grid={grid(index, 'product')}
    />
  );
});

export const AmountCell = memo(function AmountCell({ index, rowKey, name, text, fill, error }: { index: number; rowKey: string; name: string; text: string; fill: boolean; error: string }) {
  const { actions } = useLines();
  if (fill) return <span className="fill-mark">to volume</span>;
  const cell = lineCell(rowKey);
  return (
    <CellInput
      label={`Amount, ${name}`}
      text={text}
      numeric
      errors={list(error)}
      onType={(t) => actions.type(cell, t)}
      onCommit={() => actions.commit(cell, `Amount, line ${index + 1}`)}
      onCancel={actions.cancel}
      extra={grid(index, 'amount')}
    />
  );
});

export const UnitCell = memo(function UnitCell({ index, name, line, error }: { index: number; name: string; line: DraftLine; error: string }) {
  const { actions, catalog } = useLines();
  const choices: UnitChoice[] = [...unitChoices(catalog.byId.get(line.product)), FILL];
  const value = line.fill ? FILL : line.unit ?? '';
  const foreign = value !== '' && !choices.includes(value as UnitChoice);
  return (
    <span className="cell">
      <select aria-label={`Unit, ${name}`} value={value} aria-invalid={error ? true : undefined}
        onChange={(e) => actions.edit(`Unit, line ${index + 1}: ${value || 'none'} → ${e.target.value}`, (d) => setUnit(d, index, e.target.value as UnitChoice, catalog))}
        {...grid(index, 'unit')}>
        {value === '' ? <option value="">unit…</option> : null}
        {foreign ? <option value={value}>{value} (not for this stock)</option> : null}
        {choices.map((u) => <option key={u} value={u}>{u === FILL ? 'fill (to volume)' : u}</option>)}
      </select>
      <Errors error={error} />
    </span>
  );
});

const speciesText = (s: string) => (s === 'glycerophosphate' ? 'organic P' : s);

export const SpeciesCell = memo(function SpeciesCell({ index, name, line, error }: { index: number; name: string; line: DraftLine; error: string }) {
  const { actions, catalog } = useLines();
  const product = catalog.byId.get(line.product);
  const unit = line.unit ?? '';
  if (!product || line.fill || !(LINE_UNITS as readonly string[]).includes(unit)) return null;
  const base = baseUnit(unit as LineUnit);
  if (base !== 'mEq' && base !== 'mmol') return null;
  const choices: string[] = speciesChoices(product, base);
  const value = line.species ?? (product.orderSpecies && choices.includes(product.orderSpecies) ? product.orderSpecies : '');
  if (choices.length === 1 && value === choices[0] && !error) return <span className="species-one">{speciesText(value)}</span>;
  return (
    <span className="cell">
      <select aria-label={`Counted species, ${name}`} value={value} aria-invalid={error ? true : undefined}
        onChange={(e) => actions.edit(`Species, line ${index + 1}: ${value || 'default'} → ${e.target.value}`, (d) => setSpecies(d, index, e.target.value))}
        {...grid(index, 'species')}>
        {value === '' || !choices.includes(value) ? <option value={value}>{value ? `${speciesText(value)} (not in this stock)` : 'species…'}</option> : null}
        {choices.map((s) => <option key={s} value={s}>{speciesText(s)}</option>)}
      </select>
      <Errors error={error} />
    </span>
  );
});

export const MoveCell = memo(function MoveCell({ index, name, last }: { index: number; name: string; last: boolean }) {
  const { actions } = useLines();
  return (
    <span className="move">
      <span className="n">{index + 1}</span>
      <button type="button" className="icon" aria-label={`Move up, ${name}`} disabled={index === 0}
        onClick={() => actions.edit(`Move line ${index + 1} up`, (d) => moveLine(d, index, -1))} {...grid(index, 'up')}>↑</button>
      <button type="button" className="icon" aria-label={`Move down, ${name}`} disabled={last}
        onClick={() => actions.edit(`Move line ${index + 1} down`, (d) => moveLine(d, index, 1))} {...grid(index, 'down')}>↓</button>
    </span>
  );
});

export const RemoveCell = memo(function RemoveCell({ index, name }: { index: number; name: string }) {
  const { actions } = useLines();
  return (
    <button type="button" className="icon remove" aria-label={`Remove ${name}`}
      onClick={() => actions.edit(`Remove ${name}`, (d) => removeLine(d, index))} {...grid(index, 'remove')}>×</button>
  );
});

/** Per day and per kg per day, as the report states them. */
export function DoseCell({ row, per }: { row: LineRow; per: 'day' | 'kg' }) {
  const amount = per === 'day' ? row.computed?.perDay : row.computed?.perKgPerDay;
  if (!amount) return <span className="muted">—</span>;
  return <>{showAmount(amount.amount)} {amount.unit}</>;
}

/** A figure of the report line: stock volume, mOsm, share of the bag's particles. */
export function FigureCell({ row, figure }: { row: LineRow; figure: 'volumeMl' | 'mOsm' | 'sharePercent' }) {
  const r = row.computed;
  if (!r) return <span className="muted">—</span>;
  if (figure === 'volumeMl') return <>{show(r.volumeMl, 2)}</>;
  if (figure === 'mOsm') return <>{show(r.mOsm, 1)}</>;
  return <>{show(r.sharePercent, 1)}%</>;
}
