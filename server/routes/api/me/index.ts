import { Router } from 'express';
import { resultInputSchema } from '@shared/schemas/result';
import { duplicatesSchema, followSchema, notificationSettingsAnswerSchema, unsubscribedSchema, type Presented } from '@shared/schemas/responses';
import { followParams, followInputSchema, notificationSettingsSchema, unsubscribeSchema } from '@shared/schemas/publishing';
import { EMAIL_TOPICS } from '@shared/schemas/publishing';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { badRequest } from '../../../errors';
import type { User } from '../../../models';
import { ownPage, resultsForExport } from '../../../queries/profiles';
import { abrasiveNames } from '../../../queries/compare-lookups';
import { presentOwnPage } from '../../../presenters/profile';
import { findDuplicates } from '../../../queries/duplicates';
import { followPage, unfollowPage } from '../../../commands/follow-page';
import { updateNotificationSettings } from '../../../commands/update-notification-settings';
import { verifyUnsubscribe } from '../../../mail/unsubscribe';
import { resultsCsv } from '../../../presenters/result-csv';
import { emptyQuerySchema } from '@shared/schemas/common';


/** The member's own page and settings: drafts and decisions, follows, e-mail, export, duplicate check, unsubscribe. */
export function meRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/me', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    res.set('Cache-Control', 'no-store').json(presentOwnPage(await ownPage(req.user as User), await abrasiveNames()));
  }));

  router.get('/me/results.csv', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    const user = req.user as User;
    res.set('Cache-Control', 'no-store').type('text/csv; charset=utf-8').attachment(`edgeledger-${user.handle}-all-results.csv`).send(resultsCsv(await resultsForExport(user.id, true)));
  }));

  router.put('/me/notifications', requireUser, route({ body: notificationSettingsSchema }, async (req, res) => {
    const s = await updateNotificationSettings(ctx, actorOf(req)!.id, req.valid.body);
    res.json({ review: s.review, application: s.application, digest: s.digest } satisfies Presented<typeof notificationSettingsAnswerSchema>);
  }));

  router.post('/me/follows', requireUser, route({ body: followInputSchema }, async (req, res) => {
    const { pageType, slug } = req.valid.body;
    await followPage(ctx, actorOf(req)!, pageType, slug);
    res.status(201).json({ pageType, slug, following: true } satisfies Presented<typeof followSchema>);
  }));

  router.delete('/me/follows/:pageType/:slug', requireUser, route({ params: followParams }, async (req, res) => {
    const { pageType, slug } = req.valid.params;
    await unfollowPage(ctx, actorOf(req)!, pageType, slug);
    res.status(204).end();
  }));

  router.post('/me/duplicate-check', requireUser, route({ body: resultInputSchema }, async (req, res) => {
    res.json({ duplicates: await findDuplicates(actorOf(req)!.id, req.valid.body) } satisfies Presented<typeof duplicatesSchema>);
  }));

  // No sign-in: the signed link from an e-mail is the proof. Accepts the parameters in the query
  // (one-click List-Unsubscribe, RFC 8058) or in a JSON body (the unsubscribe page).
  router.post('/me/unsubscribe', async (req, res) => {
    const raw = Object.keys(req.query).length ? req.query : (req.body ?? {});
    const parsed = unsubscribeSchema.safeParse(raw);
    if (!parsed.success) throw badRequest('This unsubscribe link is incomplete.', parsed.error.issues.map((i) => ({ path: i.path.join('.') || 'link', message: i.message })));
    const { user, topic, sig } = parsed.data;
    if (!verifyUnsubscribe(ctx.env, user, topic, sig)) throw badRequest('This unsubscribe link is not valid; use the link from the message itself, or change your e-mail settings on your page.', [{ path: 'sig', message: 'does not match' }]);
    await updateNotificationSettings(ctx, user, { [topic]: false });
    res.json({ topic, topicLabel: EMAIL_TOPICS[topic], unsubscribed: true } satisfies Presented<typeof unsubscribedSchema>);
  });

  return router;
}
