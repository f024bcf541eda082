import { useId, useState } from 'react';
import { ApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Textarea } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import { pageReviewSchema, useReviewRevision, type PageReview } from '../api/review-revision';

/**
 * A moderator's decision on a proposed page edit: approve it (live at once; merged with later
 * edits when the page moved on) or decline it with a note the author sees.
 */
export function ReviewRevisionForm({ id, number, onDecided }: { id: number; number: number; onDecided?: () => void }) {
  const noteId = useId();
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | undefined>();
  const review = useReviewRevision({ onSuccess: () => onDecided?.() });
  const decide = (decision: PageReview['decision']) => {
    const trimmed = note.trim();
    const parsed = pageReviewSchema.safeParse({ decision, ...(trimmed ? { note: trimmed } : {}) });
    if (!parsed.success) {
      setNoteError(parsed.error.issues[0]?.message);
      return;
    }
    setNoteError(undefined);
    review.mutate({ id, input: parsed.data });
  };
  const error =
    review.error instanceof ApiError && review.error.status === 409
      ? review.error.error
      : review.error
        ? describeError(review.error)
        : null;
  return (
    <form
      aria-label={`Decision on revision ${number}`}
      className="flex flex-col gap-4 rounded-md border border-rule bg-panel p-4"
      onSubmit={(e) => {
        e.preventDefault();
        decide('approve');
      }}
    >
      <Field id={noteId} label="Note to the author" hint="Needed to decline: say why. Optional when approving." error={noteError}>
        <Textarea {...controlA11y(noteId, { hint: true, error: noteError })} value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
      </Field>
      {error ? (
        <p role="alert" className="text-danger">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={review.isPending && review.variables?.input.decision === 'approve'} disabled={review.isPending}>
          Approve edit
        </Button>
        <Button variant="danger" onClick={() => decide('decline')} busy={review.isPending && review.variables?.input.decision === 'decline'} disabled={review.isPending}>
          Decline edit
        </Button>
      </div>
    </form>
  );
}
