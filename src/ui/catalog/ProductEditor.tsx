import { useId, useMemo, useState } from 'react';
import { ROLES, type Catalog } from '../../core/catalog.ts';
import { formatProblem } from '../../core/problems.ts';
import { SPECIES, SPECIES_IDS } from '../../core/species.ts';
import { ROLE_TEXT } from '../show.ts';
import { formFieldOf, formFromProduct, emptyForm, productFromForm, withProduct, type ProductForm } from './productForm.ts';

interface Props {
  file: unknown;
  /** Index of the product being edited; products.length for a new one. */
  index: number;
  original: unknown;
  onSave(file: unknown, catalog: Catalog, label: string): void;
  onClose(): void;
}

const TEXT: { key: string; label: string; hint?: string }[] = [
  { key: 'id', label: 'Id', hint: 'lowercase letters, digits and dashes' },
  { key: 'name', label: 'Generic name' },
  { key: 'strength', label: 'Strength (as labelled)' },
  { key: 'mOsmPerMl', label: 'Labelled osmolarity, mOsm/mL' },
  { key: 'kcalPerMl', label: 'Energy, kcal/mL' },
  { key: 'aluminumMcgPerL', label: 'Aluminum (labelled maximum), µg/L' },
  { key: 'nutrient.gramsPerMl', label: 'Nutrient, g/mL' },
  { key: 'nutrient.mOsmPerGram', label: 'Nutrient particles, mOsm/g' },
  { key: 'nutrient.kcalPerGram', label: 'Nutrient energy, kcal/g' },
];

/**
 * Add or edit one stock. Every keystroke re-validates the whole catalog with the file format's own rules;
 * problems show by their field and as `path: message`; Save is possible only when there are none.
 */
export function ProductEditor({ file, index, original, onSave, onClose }: Props) {
  const id = useId();
  const [form, setForm] = useState<ProductForm>(() => (original === undefined ? emptyForm() : formFromProduct(original)));
  const candidate = useMemo(() => withProduct(file, index, productFromForm(form, original)), [file, index, form, original]);
  const problems = candidate.result.ok ? [] : candidate.result.problems;
  const at = (key: string) => problems.filter((p) => formFieldOf(p.path, index) === key).map((p) => p.message);
  const set = (key: string, value: string) => setForm((f) => ({ ...f, [key]: value }));
  const input = (key: string, label: string, hint?: string) => {
    const errors = at(key);
    return (
      <span className="field" key={key}>
        <label htmlFor={`${id}-${key}`}>{label}</label>
        <input id={`${id}-${key}`} value={form[key] ?? ''} aria-invalid={errors.length > 0 || undefined}
          aria-describedby={errors.length > 0 ? `${id}-${key}-e` : undefined} placeholder={hint}
          onChange={(e) => set(key, e.target.value)} />
        {errors.length > 0 ? <span className="error" id={`${id}-${key}-e`}>{errors.join('; ')}</span> : null}
      </span>
    );
  };
  const select = (key: string, label: string, options: readonly { value: string; text: string }[]) => (
    <span className="field" key={key}>
      <label htmlFor={`${id}-${key}`}>{label}</label>
      <select id={`${id}-${key}`} value={form[key] ?? ''} onChange={(e) => set(key, e.target.value)}>
        {options.map((o) => <option key={o.value} value={o.value}>{o.text}</option>)}
      </select>
      {at(key).length > 0 ? <span className="error">{at(key).join('; ')}</span> : null}
    </span>
  );
  const save = () => {
    if (!candidate.result.ok) return;
    const name = form.name || form.id || 'product';
    onSave(candidate.file, candidate.result.value, original === undefined ? `Added ${name}` : `Edited ${name}`);
  };

  return (
    <form className="panel product-editor" data-own-undo aria-labelledby={`${id}-title`} onSubmit={(e) => { e.preventDefault(); save(); }}>
      <h2 id={`${id}-title`}>{original === undefined ? 'Add a stock' : `Edit ${form.name || form.id}`}</h2>
      <div className="form-grid">
        {TEXT.slice(0, 3).map((t) => input(t.key, t.label, t.hint))}
        {select('role', 'Role', ROLES.map((r) => ({ value: r, text: ROLE_TEXT[r] })))}
        {TEXT.slice(3).map((t) => input(t.key, t.label, t.hint))}
        {select('nutrient.basis', 'Dextrose basis', [{ value: '', text: '—' }, { value: 'hydrous', text: 'hydrous' }, { value: 'anhydrous', text: 'anhydrous' }])}
        {select('orderSpecies', 'mEq/mmol count', [{ value: '', text: 'default' }, ...SPECIES_IDS.map((s) => ({ value: s, text: SPECIES[s].label }))])}
      </div>
      <fieldset className="per-ml">
        <legend>Dissolved species, mmol per mL (ions in mmol, not mEq)</legend>
        <div className="form-grid species-grid">
          {SPECIES_IDS.map((s) => input(`perMl.${s}`, SPECIES[s].label))}
        </div>
      </fieldset>
      <span className="field sources">
        <label htmlFor={`${id}-sources`}>Sources, one per line as “field: source”</label>
        <textarea id={`${id}-sources`} rows={3} value={form.sources ?? ''} onChange={(e) => set('sources', e.target.value)} />
      </span>
      {problems.length > 0 ? (
        <div className="problems-inline" role="status">
          <p><strong>{problems.length} problem{problems.length === 1 ? '' : 's'}</strong> (the catalog file's own rules):</p>
          <ul>{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul>
        </div>
      ) : <p className="ok-note" role="status">Valid: this stock can be saved into the catalog.</p>}
      <div className="buttons">
        <button type="submit" disabled={problems.length > 0}>Save stock</button>
        <button type="button" onClick={onClose}>Cancel</button>
      </div>
    </form>
  );
}
