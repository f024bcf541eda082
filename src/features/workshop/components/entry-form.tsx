import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';

export interface EntryField {
  key: string;
  label: string;
  /** A drop-down list of value → label. */
  options?: Record<string, string>;
  /** A tick box: its value is 'true' or ''. */
  checkbox?: boolean;
  type?: 'text' | 'date';
  inputMode?: 'decimal' | 'numeric';
  /** Spans the form's full width: a list whose choices are sentences, cut short in one column. */
  wide?: boolean;
}

type Checked = { success: boolean; data?: unknown; error?: { issues: { path: PropertyKey[]; message: string }[] } };

/** First message per field of a zod result. */
export function issuesOf(result: Checked): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of result.error?.issues ?? []) out[String(issue.path[0] ?? '')] ??= issue.message;
  return out;
}

/**
 * The workshop's one form: boxes, lists and tick boxes as text, turned into the API's input by
 * `build` (lengths to mm), checked with the server's own schema before sending, each message under
 * its box; the server's refusal (e.g. a wheel that would overspeed) shown under the button. Emptied
 * after a success unless `keep`. Give it a new `key` to start again from other `initial` values.
 */
export function EntryForm<T>({
  title,
  fields,
  initial = {},
  build,
  schema,
  send,
  submitLabel = 'Add',
  keep = false,
  children,
  className = 'sm:grid-cols-2',
}: {
  title: string;
  fields: EntryField[];
  initial?: Record<string, string>;
  build: (v: Record<string, string>) => Record<string, unknown>;
  schema: { safeParse: (x: unknown) => Checked };
  send: { mutate: (input: T, opts: { onSuccess: () => void }) => void; isPending: boolean; error: Error | null };
  submitLabel?: string;
  keep?: boolean;
  children?: ReactNode;
  className?: string;
}) {
  const id = useId();
  const start = Object.fromEntries(fields.map((f) => [f.key, initial[f.key] ?? '']));
  const [v, setV] = useState<Record<string, string>>(start);
  const [tried, setTried] = useState(false);
  const checked = schema.safeParse(build(v));
  const errors = tried ? issuesOf(checked) : {};
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTried(true);
    if (checked.success) send.mutate(checked.data as T, { onSuccess: () => { if (!keep) setV(start); setTried(false); } });
  };
  const set = (key: string, value: string) => setV((old) => ({ ...old, [key]: value }));
  return (
    <form onSubmit={submit} noValidate className={`grid min-w-0 content-start items-end gap-3 self-start rounded-md border border-rule bg-panel p-4 ${className}`} aria-label={title}>
      <h3 className="col-span-full text-lg font-semibold">{title}</h3>
      {children}
      {fields.map((f) =>
        f.checkbox ? (
          <label key={f.key} className="flex items-center gap-2 pb-2 text-sm">
            <input type="checkbox" checked={v[f.key] === 'true'} onChange={(e) => set(f.key, e.target.checked ? 'true' : '')} /> {f.label}
          </label>
        ) : (
          <Field key={f.key} id={`${id}-${f.key}`} label={f.label} error={errors[f.key]} className={f.wide ? 'col-span-full' : ''}>
            {f.options ? (
              <Select id={`${id}-${f.key}`} value={v[f.key]} onChange={(e) => set(f.key, e.target.value)}>
                {Object.entries(f.options).map(([value, label]) => (
                  <option key={value} value={value}>
                    {label}
                  </option>
                ))}
              </Select>
            ) : (
              <Input id={`${id}-${f.key}`} type={f.type ?? 'text'} inputMode={f.inputMode} value={v[f.key]} onChange={(e) => set(f.key, e.target.value)} />
            )}
          </Field>
        ),
      )}
      <div className="col-span-full">
        <Button type="submit" variant="secondary" busy={send.isPending}>
          {submitLabel}
        </Button>
      </div>
      {send.error ? (
        <p role="alert" className="col-span-full text-danger">
          {describeError(send.error)}
        </p>
      ) : null}
    </form>
  );
}

/** A typed number (decimal comma accepted), undefined when the box is empty. */
export const num = (text: string) => (text.trim() === '' ? undefined : Number(text.replace(',', '.')));
