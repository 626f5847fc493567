import { useId, type InputHTMLAttributes } from 'react';

/** Props of a text cell: it shows `text` (typed or committed) and hands every keystroke up. */
export interface CellInputProps {
  label: string;
  text: string;
  errors: readonly string[];
  onType(text: string): void;
  /** Enter or leaving the cell: the typed text becomes the order's value. */
  onCommit(): void;
  /** Escape: the typed text is dropped. */
  onCancel(): void;
  className?: string;
  numeric?: boolean;
  highlighted?: boolean;
  /** Grid position attributes and the like. */
  extra?: InputHTMLAttributes<HTMLInputElement> & Record<`data-${string}`, string | number>;
  /** Show the label visibly above the input (header fields) or only to screen readers (table cells). */
  visibleLabel?: boolean;
  suffix?: string;
}

/**
 * A text input that holds the raw text as typed and commits it on Enter or blur; its problems from the
 * engine are shown right under it and announced with it.
 */
export function CellInput({ label, text, errors, onType, onCommit, onCancel, className, numeric, highlighted, extra, visibleLabel, suffix }: CellInputProps) {
  const id = useId();
  const errorId = `${id}-error`;
  const invalid = errors.length > 0;
  const classes = ['cell-input', numeric ? 'num-input' : '', invalid ? 'invalid' : '', highlighted ? 'hl' : '', className ?? ''].filter(Boolean).join(' ');
  return (
    <span className={visibleLabel ? 'field' : 'cell'}>
      {visibleLabel ? <label htmlFor={id}>{label}</label> : null}
      <span className="input-wrap">
        <input
          id={id}
          className={classes}
          value={text}
          aria-label={visibleLabel ? undefined : label}
          aria-invalid={invalid || undefined}
          aria-describedby={invalid ? errorId : undefined}
          inputMode={numeric ? 'decimal' : undefined}
          autoComplete="off"
          spellCheck={false}
          onChange={(e) => onType(e.target.value)}
          onFocus={(e) => e.target.select()}
          onBlur={onCommit}
          onKeyDown={(e) => {
            if (e.key === 'Enter') { e.preventDefault(); onCommit(); }
            else if (e.key === 'Escape') { e.preventDefault(); onCancel(); }
          }}
          {...extra}
        />
        {suffix ? <span className="suffix" aria-hidden="true">{suffix}</span> : null}
      </span>
      {invalid ? <span className="error" id={errorId}>{errors.join('; ')}</span> : null}
    </span>
  );
}
