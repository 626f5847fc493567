import { useState } from 'react';
import { parseCatalog, type Catalog, type Product } from '../../core/catalog.ts';
import type { Problem } from '../../core/problems.ts';
import { SPECIES_IDS } from '../../core/species.ts';
import { FileImport } from '../components/FileImport.tsx';
import { ProblemsList } from '../components/ProblemsList.tsx';
import { ROLE_TEXT } from '../show.ts';
import { ProductEditor } from './ProductEditor.tsx';
import { fileProducts } from './productForm.ts';

interface Props {
  catalog: Catalog;
  file: unknown;
  onReplace(file: unknown, catalog: Catalog, label: string): void;
}

function composition(p: Product): string {
  const parts = SPECIES_IDS.filter((s) => p.perMl[s] !== undefined).map((s) => `${s} ${p.perMl[s]?.toString()}`);
  const ions = parts.length > 0 ? `${parts.join(', ')} mmol/mL` : '';
  const n = p.nutrient ? `${p.nutrient.gramsPerMl.toString()} g/mL${p.nutrient.basis ? ` (${p.nutrient.basis})` : ''}, ${p.nutrient.mOsmPerGram.toString()} mOsm/g` : '';
  return [n, ions].filter(Boolean).join('; ') || '—';
}

const orDash = (v: { toString(): string } | null) => (v === null ? '—' : v.toString());

/** The stocks on the shelf: composition, labelled values and their sources; edit, add, or import a catalog file. */
export function CatalogView({ catalog, file, onReplace }: Props) {
  const [editing, setEditing] = useState<number | null>(null);
  const [importProblems, setImportProblems] = useState<Problem[]>([]);
  const [notice, setNotice] = useState<string | null>(null);
  const products = fileProducts(file);
  const importFile = (json: unknown, name: string) => {
    const r = parseCatalog(json);
    if (!r.ok) { setImportProblems(r.problems); setNotice(`${name} was not imported: the catalog in use is unchanged.`); return; }
    setImportProblems([]);
    setEditing(null);
    onReplace(json, r.value, `Imported ${name}`);
    setNotice(`Imported ${name}: ${r.value.products.length} stocks (${r.value.name}).`);
  };
  return (
    <main className="catalog-view" aria-labelledby="catalog-title">
      <div className="view-head">
        <h1 id="catalog-title">Catalog: {catalog.name}</h1>
        <span className="muted">id {catalog.id} · {catalog.products.length} stocks</span>
        <button type="button" onClick={() => setEditing(products.length)}>Add stock</button>
        <FileImport label="Import catalog file…" onJson={importFile} onProblems={(p) => { setImportProblems(p); setNotice('The file was not imported: the catalog in use is unchanged.'); }} />
      </div>
      {notice ? <p className="notice" role="status">{notice}</p> : null}
      <ProblemsList problems={importProblems} title="Problems in the imported catalog" />
      {editing !== null ? (
        <ProductEditor key={editing} file={file} index={editing} original={products[editing]}
          onClose={() => setEditing(null)}
          onSave={(f, c, label) => { onReplace(f, c, label); setEditing(null); setNotice(`${label}. Orders are now checked against the edited catalog.`); }} />
      ) : null}
      <table className="catalog-table" aria-labelledby="catalog-title">
        <thead>
          <tr>
            <th scope="col">Stock</th><th scope="col">Role</th><th scope="col">Composition</th>
            <th scope="col" className="num">Labelled mOsm/mL</th><th scope="col" className="num">kcal/mL</th>
            <th scope="col" className="num">Aluminum µg/L</th><th scope="col">Sources</th><th scope="col"><span className="sr-only">Edit</span></th>
          </tr>
        </thead>
        <tbody>
          {catalog.products.map((p, i) => (
            <tr key={p.id}>
              <th scope="row">{p.name}<span className="sub">{p.id}{p.strength ? ` · ${p.strength}` : ''}</span></th>
              <td>{ROLE_TEXT[p.role]}</td>
              <td>{composition(p)}</td>
              <td className="num">{p.mOsmPerMl === null ? <span className="muted">none (counted by particles)</span> : p.mOsmPerMl.toString()}</td>
              <td className="num">{orDash(p.kcalPerMl)}</td>
              <td className="num">{orDash(p.aluminumMcgPerL)}</td>
              <td className="sources-cell">
                {Object.keys(p.sources).length === 0 ? <span className="muted">none given</span> : (
                  <details>
                    <summary>{Object.keys(p.sources).length} source{Object.keys(p.sources).length === 1 ? '' : 's'}</summary>
                    <dl>{Object.entries(p.sources).map(([k, v]) => <div key={k}><dt>{k}</dt><dd>{v}</dd></div>)}</dl>
                  </details>
                )}
              </td>
              <td><button type="button" className="small" aria-label={`Edit ${p.name}`} onClick={() => setEditing(i)}>Edit</button></td>
            </tr>
          ))}
        </tbody>
      </table>
    </main>
  );
}
