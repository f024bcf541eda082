import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Textarea } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import type { Result } from '@/types/api';
import { retractInputSchema, useRetractResult } from '../api/retract-result';

/** The author withdraws a published result: kept, with the reason in its trail, and out of the comparison. */
export function RetractForm({ result }: { result: Result }) {
  const reasonId = useId();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | undefined>();
  const retract = useRetractResult();
  if (!result.can.retract) return null;
  if (!open) {
    return (
      <div>
        <Button variant="secondary" size="sm" onClick={() => setOpen(true)}>
          Withdraw this result…
        </Button>
      </div>
    );
  }
  return (
    <form
      aria-label="Withdraw this result"
      className="flex flex-col gap-3 rounded-md border border-rule bg-panel p-4"
      onSubmit={(e) => {
        e.preventDefault();
        const parsed = retractInputSchema.safeParse({ reason });
        if (!parsed.success) return setError(parsed.error.issues[0]?.message);
        setError(undefined);
        retract.mutate({ id: result.id, reason: parsed.data.reason });
      }}
    >
      <p>A withdrawn result stays readable with its trail but no longer counts in the comparison tables or search.</p>
      <Field id={reasonId} label="Why you withdraw it" error={error}>
        <Textarea {...controlA11y(reasonId, { error })} value={reason} maxLength={2000} onChange={(e) => setReason(e.target.value)} />
      </Field>
      {retract.isError ? (
        <p role="alert" className="text-danger">
          {describeError(retract.error)}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" variant="danger" busy={retract.isPending}>
          Withdraw
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
