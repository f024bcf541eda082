import { Router, type RequestHandler } from 'express';
import { searchQuerySchema } from '@shared/schemas/result';
import { healthSchema, type Presented, type searchAnswerSchema } from '@shared/schemas/responses';
import type { AppContext } from '../../context';
import { csrfProtection, csrfTokenOf } from '../../middleware/auth';
import { route } from '../../middleware/validate';
import { notFound } from '../../errors';
import { presentAccount } from '../../presenters/user';
import type { User } from '../../models';
import { resultsRouter } from './results';
import { pagesRouter } from './pages';
import { toolsRouter } from './tools';
import { wheelsRouter } from './wheels';
import { workshopRouter } from './workshop';
import { compareRouter } from './compare';
import { publishersRouter } from './publishers';
import { importRouter } from './import';
import { tokensRouter } from './tokens';
import { photosRouter } from './photos';
import { flagsRouter } from './flags';
import { auditRouter } from './audit';
import { profilesRouter } from './profiles';
import { meRouter } from './me';
import { devRouter } from './dev';
import { adminRouter } from './admin';
import type { MailCatcher } from '../../mail/mail-catcher';
import { emptyQuerySchema } from '@shared/schemas/common';
import { eventLoopStalls } from '../../event-loop';
import { openApiJson } from '../../openapi/document';
import type { AnswerCache } from '../../middleware/answer-cache';

export interface ApiOptions {
  /** The app's kept answers, which the busiest reads use. */
  answers: AnswerCache;
  /** The search rate limit (created with the app's other limits). */
  searchLimit: RequestHandler;
  mailCatcher?: MailCatcher;
}

/** The JSON API under /api. Every state-changing request passes the CSRF check first. */
export function apiRouter(ctx: AppContext, { answers, searchLimit, mailCatcher }: ApiOptions): Router {
  const router = Router();
  router.use(csrfProtection);

  router.get('/health', route({ query: emptyQuerySchema }, (_req, res) => {
    res.json({ ok: true, searchDocuments: ctx.search.size, pendingWrites: ctx.db.queue.size, answerCache: answers.stats(), eventLoop: eventLoopStalls() } satisfies Presented<typeof healthSchema>);
  }));

  router.get('/session', route({ query: emptyQuerySchema }, (req, res) => {
    const user = req.user as User | undefined;
    res.set('Cache-Control', 'no-store').json({ user: user ? presentAccount(user) : null, csrfToken: csrfTokenOf(req) });
  }));

  // This API's OpenAPI 3.1 document (server/openapi/), the same for everyone.
  router.get('/openapi.json', route({ query: emptyQuerySchema }, (_req, res) => {
    res.type('application/json').set('Cache-Control', 'no-cache').send(openApiJson());
  }));

  // The busiest reads first: Express tries each route of every router in turn until one matches.
  router.use(compareRouter(ctx, answers));
  // Search answers are the same for whoever asks, and are dropped once the index took a change;
  // every search, kept answer or not, counts against the search limit.
  const keptSearch = answers.keep('search', { forEveryone: true, guard: searchLimit });
  router.get('/search', keptSearch, route({ query: searchQuerySchema }, (req, res) => {
    const { q, type } = req.valid.query;
    res.json(ctx.search.search(q, type) satisfies Presented<typeof searchAnswerSchema>);
  }));
  router.use(pagesRouter(ctx, answers));
  router.use(resultsRouter(ctx));
  router.use(toolsRouter());
  router.use(wheelsRouter(ctx));
  router.use(workshopRouter(ctx));

  router.use(publishersRouter(ctx));
  router.use(importRouter(ctx));
  router.use(tokensRouter(ctx));
  router.use(photosRouter(ctx));
  router.use(flagsRouter(ctx));
  router.use(auditRouter());
  router.use(profilesRouter());
  router.use(meRouter(ctx));
  router.use(adminRouter(ctx));
  router.use(devRouter(ctx, mailCatcher));

  router.use(() => {
    throw notFound('That API route');
  });
  return router;
}
