import { can, type Actor } from '@shared/permissions';
import type { ApplicationDecisionInput } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { conflict, forbidden, HttpError, notFound } from '../errors';
import { PublisherApplication, User } from '../models';
import { notifyMember } from '../mail/notify-member';
import { recordAudit, recordRefusal } from './record-audit';

/**
 * An admin approves or declines a publisher application. Approval makes the applicant a
 * publisher in the same transaction; both outcomes are audited and mailed to the applicant.
 * An application already decided is refused with 409 (and the attempt audited).
 */
export async function decidePublisherApplication(ctx: AppContext, actor: Actor, id: number, input: ApplicationDecisionInput): Promise<PublisherApplication> {
  if (!can(actor, 'decide:publisher-application')) throw forbidden('Only admins decide publisher applications.');
  const audit = { action: `publisher-application.${input.decision}`, subjectType: 'publisher-application', subjectId: id, reason: input.note ?? null };
  await ctx.db
    .write(async (transaction) => {
      const application = await PublisherApplication.findByPk(id, { transaction });
      if (!application) throw notFound('Application');
      if (application.status !== 'pending') throw conflict(`This application was already decided: it is ${application.status}.`);
      const applicant = await User.findByPk(application.userId, { transaction });
      if (!applicant) throw notFound('Applicant');
      const status = input.decision === 'approve' ? 'approved' : 'declined';
      await application.update({ status, decidedById: actor.id, decisionNote: input.note ?? null, decidedAt: new Date() }, { transaction });
      // Staff keep their role; only a member becomes a publisher.
      if (status === 'approved' && applicant.role === 'member') await applicant.update({ role: 'publisher' }, { transaction });
      await recordAudit(actor, { ...audit, details: { applicant: applicant.handle, workshop: application.workshop } }, transaction);
    })
    .catch(async (err: unknown) => {
      if (err instanceof HttpError && err.status === 409) await recordRefusal(ctx, actor, audit, err.message);
      throw err;
    });
  const application = (await PublisherApplication.findByPk(id, { include: ['applicant', 'decidedBy'] }))!;
  const applicant = application.applicant!;
  const approved = application.status === 'approved';
  notifyMember(ctx, applicant, 'application', {
    subject: approved ? 'You are an Edgeledger publisher now' : 'Your publisher application',
    greeting: `Hello ${applicant.displayName},`,
    paragraphs: approved
      ? [`Your application for ${application.workshop} was approved. Your results now carry the publisher badge, and you can import results in bulk and create API tokens.`]
      : [`Your application for ${application.workshop} was declined. You can apply again once the reason below is dealt with.`],
    quote: application.decisionNote ? { label: approved ? "The admin's note" : 'The reason', text: application.decisionNote } : undefined,
    action: approved ? { label: 'Import results', url: `${ctx.baseUrl}/import` } : { label: 'Your page', url: `${ctx.baseUrl}/me` },
  }).catch(() => undefined);
  return application;
}
