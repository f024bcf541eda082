import { useId, useState } from 'react';
import type { FlagReason, FlagSubject } from '@shared/schemas/publishing';
import { useUser } from '@/lib/auth';
import { ApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Select, Textarea } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import { FLAG_REASONS, flagInputSchema, useCreateFlag } from '../api/create-flag';

/** "Flag this": any signed-in member tells the moderators what is wrong with a published result or a page. */
export function FlagForm({ subjectType, subject, what }: { subjectType: FlagSubject; subject: number | string; what: string }) {
  const user = useUser();
  const reasonId = useId();
  const textId = useId();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState<FlagReason>('implausible-figures');
  const [text, setText] = useState('');
  const [error, setError] = useState<string | undefined>();
  const flag = useCreateFlag();
  if (!user) return null;
  if (flag.isSuccess) return <p role="status" className="text-sm">Thank you: the moderators will look at your flag.</p>;
  if (!open) {
    return (
      <div>
        <Button variant="quiet" size="sm" onClick={() => setOpen(true)}>
          Flag {what}…
        </Button>
      </div>
    );
  }
  const already = flag.error instanceof ApiError && flag.error.status === 409;
  return (
    <form
      aria-label={`Flag ${what}`}
      className="flex max-w-xl flex-col gap-3 rounded-md border border-rule bg-panel p-4"
      onSubmit={(e) => {
        e.preventDefault();
        const parsed = flagInputSchema.safeParse({ subjectType, subject, reason, ...(text.trim() ? { text: text.trim() } : {}) });
        if (!parsed.success) return setError(parsed.error.issues[0]?.message);
        setError(undefined);
        flag.mutate(parsed.data);
      }}
    >
      <Field id={reasonId} label="What is wrong">
        <Select id={reasonId} value={reason} onChange={(e) => setReason(e.target.value as FlagReason)}>
          {(Object.keys(FLAG_REASONS) as FlagReason[]).map((r) => (
            <option key={r} value={r}>
              {FLAG_REASONS[r]}
            </option>
          ))}
        </Select>
      </Field>
      <Field id={textId} label="Details" aside={reason === 'other' ? 'required' : 'optional'} error={error}>
        <Textarea {...controlA11y(textId, { error })} value={text} maxLength={1000} onChange={(e) => setText(e.target.value)} />
      </Field>
      {flag.isError ? (
        <p role="alert" className="text-danger">
          {already ? 'You already flagged this; a moderator will look at it.' : describeError(flag.error)}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" busy={flag.isPending}>
          Send flag
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
