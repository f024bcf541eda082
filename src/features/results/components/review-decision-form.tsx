import { useId, useState } from 'react';
import { ApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Textarea } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import type { Result } from '@/types/api';
import { reviewInputSchema, useReviewResult, type ReviewInput } from '../api/review-result';
import { useReviewResultRevision } from '../api/review-result-revision';

type Decision = ReviewInput['decision'];

/** Keyboard shortcuts inside the decision form, by physical key (listed on the review desk). */
export const SHORTCUTS: Record<string, Decision> = { KeyA: 'approve', KeyR: 'return', KeyJ: 'reject' };

/**
 * A moderator's decision on one pending result, or on a correction (`revision`) of a published
 * one: approve it, return it with a note saying what to change, or reject it with a reason.
 * The shared review schema decides when a note is needed. `onDecided` hears the decision.
 */
export function ReviewDecisionForm({
  result,
  revision,
  onDecided,
}: {
  result: Result;
  revision?: number;
  onDecided?: (result: Result, decision: Decision) => void;
}) {
  const noteId = useId();
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | undefined>();
  const ofResult = useReviewResult({ onSuccess: (r) => onDecided?.(r, ofResult.variables!.input.decision) });
  const ofRevision = useReviewResultRevision({ onSuccess: (done) => onDecided?.(done.result, ofRevision.variables!.input.decision) });
  const review = revision ? ofRevision : ofResult;

  const decide = (decision: Decision) => {
    const trimmed = note.trim();
    const parsed = reviewInputSchema.safeParse({ decision, ...(trimmed ? { note: trimmed } : {}) });
    if (!parsed.success) {
      setNoteError(parsed.error.issues.find((i) => i.path[0] === 'note')?.message ?? parsed.error.issues[0]?.message);
      return;
    }
    setNoteError(undefined);
    if (revision) ofRevision.mutate({ id: result.id, rev: revision, input: parsed.data });
    else ofResult.mutate({ id: result.id, input: parsed.data });
  };

  const serverError =
    review.error instanceof ApiError && review.error.status === 409
      ? `Another moderator has already decided on this ${revision ? 'correction' : 'result'}; it has left the queue.`
      : review.error
        ? describeError(review.error)
        : null;

  return (
    <form
      aria-label={revision ? `Decision on the correction of result ${result.id}` : `Decision on result ${result.id}`}
      className="flex flex-col gap-4 rounded-md border border-rule bg-panel p-4"
      onSubmit={(e) => {
        e.preventDefault();
        decide('approve');
      }}
      onKeyDown={(e) => {
        // The shortcuts listed on the desk: while the form has focus, Alt+A, Alt+R, Alt+J decide.
        const key = e.altKey && !e.ctrlKey && !e.metaKey ? SHORTCUTS[e.code] : undefined;
        if (!key || review.isPending) return;
        e.preventDefault();
        decide(key);
      }}
    >
      <Field
        id={noteId}
        label="Note to the author"
        hint="Needed to return or reject: say what to change, or why. The author sees it on their result. Keys: Alt+A approve, Alt+R return, Alt+J reject."
        error={noteError}
      >
        <Textarea
          {...controlA11y(noteId, { hint: true, error: noteError })}
          value={note}
          maxLength={2000}
          onChange={(e) => {
            setNote(e.target.value);
            if (noteError && e.target.value.trim()) setNoteError(undefined);
          }}
        />
      </Field>
      {serverError ? (
        <p role="alert" className="text-danger">
          {serverError}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={review.isPending && review.variables?.input.decision === 'approve'} disabled={review.isPending}>
          Approve
        </Button>
        <Button
          variant="secondary"
          onClick={() => decide('return')}
          busy={review.isPending && review.variables?.input.decision === 'return'}
          disabled={review.isPending}
        >
          Return with note
        </Button>
        <Button
          variant="danger"
          onClick={() => decide('reject')}
          busy={review.isPending && review.variables?.input.decision === 'reject'}
          disabled={review.isPending}
        >
          Reject
        </Button>
      </div>
    </form>
  );
}
