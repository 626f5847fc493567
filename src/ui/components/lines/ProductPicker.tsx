import { useId, useMemo, useState, type KeyboardEvent } from 'react';
import { ROLES, type Catalog, type Product } from '../../../core/catalog.ts';
import { ROLE_TEXT } from '../../show.ts';

interface Props {
  catalog: Catalog;
  value: string;
  label: string;
  errors: readonly string[];
  onPick(productId: string): void;
  grid: Record<`data-${string}`, string | number>;
}

/** Catalog products whose name, id, strength or role contains every typed word, grouped by role. */
export function searchProducts(catalog: Catalog, query: string): { role: (typeof ROLES)[number]; products: Product[] }[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  const hit = (p: Product) => {
    const hay = `${p.name} ${p.id} ${p.strength ?? ''} ${ROLE_TEXT[p.role]}`.toLowerCase();
    return words.every((w) => hay.includes(w));
  };
  return ROLES.map((role) => ({ role, products: catalog.products.filter((p) => p.role === role && hit(p)) })).filter((g) => g.products.length > 0);
}

/**
 * A searchable stock picker (ARIA combobox with a grouped listbox). Typing filters; ArrowUp/ArrowDown
 * move through the matches while the list is open; Enter picks; Escape closes without changing.
 */
export function ProductPicker({ catalog, value, label, errors, onPick, grid }: Props) {
  const id = useId();
  const [query, setQuery] = useState<string | null>(null);
  const [active, setActive] = useState(0);
  const open = query !== null;
  const groups = useMemo(() => (open ? searchProducts(catalog, query) : []), [catalog, query, open]);
  const flat = groups.flatMap((g) => g.products);
  const current = catalog.byId.get(value);
  const close = () => { setQuery(null); setActive(0); };
  const pick = (p: Product | undefined) => { if (p) onPick(p.id); close(); };
  const optionId = (i: number) => `${id}-opt-${i}`;
  const invalid = errors.length > 0;

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (!open) {
      // Typing starts a new search (it does not edit the shown stock name).
      const printable = e.key.length === 1 && !e.ctrlKey && !e.metaKey && !e.altKey;
      if (printable || e.key === 'Backspace' || (e.key === 'ArrowDown' && e.altKey) || e.key === 'F4') {
        e.preventDefault();
        setQuery(printable ? e.key : '');
        setActive(0);
      }
      return;
    }
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      if (flat.length > 0) setActive((a) => (a + (e.key === 'ArrowDown' ? 1 : flat.length - 1)) % flat.length);
    } else if (e.key === 'Enter') {
      e.preventDefault();
      pick(flat[active]);
    } else if (e.key === 'Escape') {
      e.preventDefault();
      close();
    }
  };

  const starts = groups.map((_, gi) => groups.slice(0, gi).reduce((sum, g) => sum + g.products.length, 0));
  return (
    <span className={`cell picker-cell${open ? ' open' : ''}`}>
      <input
        id={id}
        role="combobox"
        className={`cell-input product-input${invalid ? ' invalid' : ''}`}
        aria-label={label}
        aria-expanded={open}
        aria-controls={`${id}-list`}
        aria-autocomplete="list"
        aria-activedescendant={open && flat.length > 0 ? optionId(active) : undefined}
        aria-invalid={invalid || undefined}
        aria-describedby={invalid ? `${id}-error` : undefined}
        placeholder="Type to search stocks"
        title={current?.name}
        autoComplete="off"
        spellCheck={false}
        value={open ? query : current?.name ?? value}
        onChange={(e) => { setQuery(e.target.value); setActive(0); }}
        onBlur={close}
        onKeyDown={onKeyDown}
        {...grid}
      />
      {open ? (
        <div className="picker-pop" id={`${id}-list`} role="listbox" aria-label={`Stocks matching “${query}”`}>
          {flat.length === 0 ? <p className="picker-none">No stock matches.</p> : groups.map((g, gi) => (
            <div key={g.role} role="group" aria-labelledby={`${id}-g-${g.role}`}>
              <div className="picker-group" id={`${id}-g-${g.role}`} role="presentation">{ROLE_TEXT[g.role]}</div>
              {g.products.map((p, pi) => {
                const i = (starts[gi] ?? 0) + pi;
                return (
                  <div key={p.id} id={optionId(i)} role="option" aria-selected={i === active}
                    className={`picker-option${i === active ? ' active' : ''}`}
                    onMouseDown={(e) => e.preventDefault()}
                    onClick={() => pick(p)}>
                    {p.name}
                  </div>
                );
              })}
            </div>
          ))}
        </div>
      ) : null}
      {invalid ? <span className="error" id={`${id}-error`}>{errors.join('; ')}</span> : null}
    </span>
  );
}
