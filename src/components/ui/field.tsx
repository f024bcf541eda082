import type { InputHTMLAttributes, ReactNode, Ref, SelectHTMLAttributes, TextareaHTMLAttributes } from 'react';

const control =
  'block w-full rounded-md border border-rule bg-panel px-3 py-2 text-ink placeholder:text-muted/70 aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-soft/40';

/** Ids of a field's hint and error, so the control can point at them with aria-describedby. */
export function describedBy(id: string, opts: { hint?: ReactNode; error?: string }): string | undefined {
  const ids = [opts.hint ? `${id}-hint` : null, opts.error ? `${id}-error` : null].filter(Boolean);
  return ids.length ? ids.join(' ') : undefined;
}

/** The accessibility props a control needs to be tied to its field's hint and error. */
export function controlA11y(id: string, opts: { hint?: ReactNode; error?: string }) {
  return {
    id,
    'aria-invalid': opts.error ? (true as const) : undefined,
    'aria-describedby': describedBy(id, opts),
  };
}

/** Upper-cases the first letter, so schema messages ("required") read as sentences. */
export function sentence(message: string | undefined): string | undefined {
  if (!message) return message;
  return message.charAt(0).toUpperCase() + message.slice(1);
}

export interface FieldProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  /** Shown beside the label, e.g. "optional". */
  aside?: ReactNode;
  className?: string;
  children: ReactNode;
}

/** A labelled form field with an optional hint and its error underneath. */
export function Field({ id, label, hint, error, aside, className = '', children }: FieldProps) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="flex items-baseline justify-between gap-2 font-medium">
        <span>{label}</span>
        {aside ? <span className="text-sm font-normal text-muted">{aside}</span> : null}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-medium text-danger">
          {sentence(error)}
        </p>
      ) : null}
    </div>
  );
}

/** A text or number box styled for Edgeledger. */
export function Input({ className = '', ...rest }: InputHTMLAttributes<HTMLInputElement> & { ref?: Ref<HTMLInputElement> }) {
  return <input className={`${control} ${className}`} {...rest} />;
}

/** A drop-down list styled for Edgeledger. */
export function Select({ className = '', ...rest }: SelectHTMLAttributes<HTMLSelectElement> & { ref?: Ref<HTMLSelectElement> }) {
  return <select className={`${control} pr-8 ${className}`} {...rest} />;
}

/** The options of a select of pages (steels, abrasives, methods): value the slug, text the name. */
export function PageOptions({ pages }: { pages: readonly { slug: string; name: string }[] }) {
  return pages.map((p) => (
    <option key={p.slug} value={p.slug}>
      {p.name}
    </option>
  ));
}

/** A multi-line text box styled for Edgeledger. */
export function Textarea({ className = '', ...rest }: TextareaHTMLAttributes<HTMLTextAreaElement> & { ref?: Ref<HTMLTextAreaElement> }) {
  return <textarea className={`${control} min-h-24 ${className}`} {...rest} />;
}
