import { STATUS_LABELS } from '@shared/vocabulary';
import type { AppContext } from '../context';
import type { Result, User } from '../models';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** Tells the author, by e-mail with a plain-text and an HTML part, how their result was decided. */
export async function notifyReviewOutcome(ctx: AppContext, author: User, result: Result, note?: string): Promise<void> {
  if (!author.email) return;
  const state = STATUS_LABELS[result.status];
  const url = `${ctx.baseUrl}/results/${result.id}`;
  const lines = [`Hello ${author.displayName},`, '', `Your result #${result.id} (${result.steel?.name ?? ''} on ${result.abrasive?.name ?? ''}) is now: ${state}.`];
  if (note) lines.push('', `The moderator's note: ${note}`);
  lines.push('', `See it at ${url}`);
  await ctx.mailer.send({
    to: author.email,
    subject: `Your result #${result.id}: ${state}`,
    text: lines.join('\n'),
    html: `<p>Hello ${escape(author.displayName)},</p><p>Your result #${result.id} is now: <strong>${escape(state)}</strong>.</p>${note ? `<p>The moderator's note: ${escape(note)}</p>` : ''}<p><a href="${escape(url)}">See it on Edgeledger</a></p>`,
  });
}
