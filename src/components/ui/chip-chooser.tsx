import { useId, useMemo, useRef, useState } from 'react';

export interface ChipChooserProps {
  label: string;
  /** [value, label] pairs, in the order to offer them. */
  options: readonly (readonly [string, string])[];
  value: string[];
  onChange: (next: string[]) => void;
  /** Said beside the label when nothing is chosen, e.g. "all". */
  noneMeans?: string;
  hint?: string;
}

/**
 * Several values chosen by typing: a text box that narrows the options as one types (a
 * combobox with its list), the chosen ones shown as chips that a press removes. Keyboard: ↓/↑
 * move in the list, Enter chooses, Escape closes it, Backspace in the empty box removes the last
 * chip. No modifier keys anywhere.
 */
export function ChipChooser({ label, options, value, onChange, noneMeans = 'all', hint }: ChipChooserProps) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const [text, setText] = useState('');
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const chosen = new Set(value);
  const labelOf = useMemo(() => new Map(options), [options]);
  const needle = text.trim().toLowerCase();
  const offered = options.filter(([v, l]) => !chosen.has(v) && (!needle || l.toLowerCase().includes(needle) || v.includes(needle)));
  const at = Math.min(active, Math.max(0, offered.length - 1));
  const listId = `${id}-list`;

  const choose = (v: string) => {
    onChange([...value, v]);
    setText('');
    setActive(0);
    input.current?.focus();
  };
  const remove = (v: string) => onChange(value.filter((x) => x !== v));

  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={`${id}-input`} className="flex items-baseline justify-between gap-2 font-medium">
        <span>{label}</span>
        <span className="text-sm font-normal text-muted">{value.length ? `${value.length} chosen` : noneMeans}</span>
      </label>
      {value.length ? (
        <ul aria-label={`${label}: chosen`} className="flex flex-wrap gap-1.5">
          {value.map((v) => (
            <li key={v}>
              <button
                type="button"
                onClick={() => remove(v)}
                aria-label={`Remove ${labelOf.get(v) ?? v}`}
                className="inline-flex max-w-full items-center gap-1 rounded-full border border-accent/40 bg-accent-soft px-2.5 py-0.5 text-sm text-accent-strong hover:border-accent"
              >
                <span className="truncate">{labelOf.get(v) ?? v}</span>
                <span aria-hidden="true">×</span>
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      <div className="relative">
        <input
          ref={input}
          id={`${id}-input`}
          type="text"
          role="combobox"
          autoComplete="off"
          aria-expanded={open && offered.length > 0}
          aria-controls={listId}
          aria-autocomplete="list"
          aria-activedescendant={open && offered.length ? `${id}-opt-${at}` : undefined}
          aria-describedby={hint ? `${id}-hint` : undefined}
          placeholder={value.length ? 'Add another…' : 'Type to find…'}
          value={text}
          className="block w-full rounded-md border border-rule bg-panel px-3 py-2 text-ink placeholder:text-muted/70"
          onChange={(e) => {
            setText(e.target.value);
            setActive(0);
            setOpen(true);
          }}
          onFocus={() => setOpen(true)}
          onBlur={() => setOpen(false)}
          onKeyDown={(e) => {
            if (e.key === 'ArrowDown') {
              e.preventDefault();
              setOpen(true);
              setActive(Math.min(at + 1, offered.length - 1));
            } else if (e.key === 'ArrowUp') {
              e.preventDefault();
              setActive(Math.max(at - 1, 0));
            } else if (e.key === 'Enter') {
              e.preventDefault();
              if (open && offered[at]) choose(offered[at][0]);
            } else if (e.key === 'Escape') {
              setOpen(false);
            } else if (e.key === 'Backspace' && !text && value.length) {
              remove(value[value.length - 1]);
            }
          }}
        />
        <ul
          id={listId}
          role="listbox"
          aria-label={label}
          hidden={!open || offered.length === 0}
          className="absolute z-20 mt-1 max-h-56 w-full overflow-y-auto rounded-md border border-rule bg-panel py-1 shadow-lg"
        >
          {offered.map(([v, l], i) => (
            <li
              key={v}
              id={`${id}-opt-${i}`}
              role="option"
              aria-selected={i === at}
              className={`cursor-pointer px-3 py-1.5 text-sm ${i === at ? 'bg-accent-soft text-accent-strong' : ''}`}
              // Chosen on mouse down, before the box's blur closes the list.
              onMouseDown={(e) => {
                e.preventDefault();
                choose(v);
              }}
              onMouseEnter={() => setActive(i)}
            >
              {l}
            </li>
          ))}
        </ul>
      </div>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
