import { STATUS_LABELS } from '@shared/vocabulary';
import type { AppContext } from '../context';
import type { Result, User } from '../models';
import { notifyMember } from '../mail/notify-member';

const sentences: Partial<Record<Result['status'], string>> = {
  approved: 'It is published now and counts in the comparison tables.',
  returned: 'A moderator asked for changes before it can be published; their note is below.',
  rejected: 'A moderator declined it; their reason is below.',
};

/**
 * Tells the author, by e-mail with a plain-text and an HTML part, how their result was decided
 * (unless they turned these messages off). Resolves true when a message was sent.
 */
export async function notifyReviewOutcome(ctx: AppContext, author: User, result: Result, note?: string): Promise<boolean> {
  const state = STATUS_LABELS[result.status];
  const what = `${result.steel?.name ?? result.input.steel} on ${result.abrasive?.name ?? result.input.abrasive}`;
  return notifyMember(ctx, author, 'review', {
    subject: `Your result #${result.id}: ${state}`,
    greeting: `Hello ${author.displayName},`,
    paragraphs: [`Your result #${result.id} (${what}) is now: ${state}.`, sentences[result.status] ?? ''].filter(Boolean),
    quote: note ? { label: result.status === 'rejected' ? 'The reason' : "The moderator's note", text: note } : undefined,
    action: { label: 'See it on Edgeledger', url: `${ctx.baseUrl}/results/${result.id}` },
  });
}
