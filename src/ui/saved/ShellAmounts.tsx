import { useState } from 'react';
import type { Catalog } from '../../core/catalog.ts';
import type { JsonObject } from '../../store/types.ts';
import './saved.css';

/** An order file's lines as the editor reads them. */
function linesOf(file: JsonObject): JsonObject[] {
  return Array.isArray(file.lines) ? (file.lines as unknown[]).filter((l): l is JsonObject => typeof l === 'object' && l !== null && !Array.isArray(l)) : [];
}

function text(value: unknown): string {
  return typeof value === 'string' || typeof value === 'number' ? String(value) : '';
}

/**
 * A plain amounts editor for the shell (until the order workspace replaces it): each line's amount and
 * the bag volume, committed on Enter or when the field is left. Each commit is one edit.
 */
export function ShellAmounts({ file, catalog, onCommit }: { file: JsonObject; catalog: Catalog; onCommit(next: JsonObject, label: string): void }) {
  const [typing, setTyping] = useState<{ field: string; text: string } | null>(null);
  const lines = linesOf(file);
  const value = (field: string, stored: string) => (typing?.field === field ? typing.text : stored);
  const commit = (field: string) => {
    if (!typing || typing.field !== field) return;
    const t = typing.text.trim();
    setTyping(null);
    if (field === 'volumeMl') {
      if (t !== text(file.volumeMl)) onCommit({ ...file, volumeMl: t }, `Bag volume ${t} mL`);
      return;
    }
    const i = Number(field.slice('line'.length));
    const line = lines[i];
    if (!line || t === text(line.amount)) return;
    onCommit({ ...file, lines: lines.map((l, j) => (j === i ? { ...l, amount: t } : l)) }, `Line ${i + 1} amount ${t}`);
  };
  const input = (field: string, label: string, stored: string) => (
    <input type="text" inputMode="decimal" size={8} aria-label={label} value={value(field, stored)}
      onChange={(e) => setTyping({ field, text: e.target.value })}
      onBlur={() => commit(field)}
      onKeyDown={(e) => { if (e.key === 'Enter') commit(field); if (e.key === 'Escape') setTyping(null); }} />
  );
  return (
    <section className="panel saved" aria-label="Change amounts">
      <h2>Change amounts</h2>
      <div className="row">
        <label>Bag volume (mL){input('volumeMl', 'Bag volume (mL)', text(file.volumeMl))}</label>
        {lines.map((l, i) => {
          const name = catalog.byId.get(text(l.product))?.name ?? text(l.product);
          if (l.fill === true) return null;
          return <label key={i}>{name} ({text(l.unit)}){input(`line${i}`, `Amount, line ${i + 1}, ${name}`, text(l.amount))}</label>;
        })}
      </div>
    </section>
  );
}
