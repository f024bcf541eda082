import { Router } from 'express';
import { can } from '@shared/permissions';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import {
  abrasiveListQuerySchema,
  PAGE_SECTIONS,
  PAGE_TYPES,
  pageCreateSchemas,
  pageEditSchemas,
  pageMergeSchema,
  pageProtectSchema,
  pageRevertSchema,
  pageReviewSchema,
  revisionParams,
  slugParams,
  steelListQuerySchema,
} from '@shared/schemas/pages';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import type { AnswerCache } from '../../../middleware/answer-cache';
import { forbidden, notFound } from '../../../errors';
import { keptUntil } from '../../../queries/kept-until';
import { abrasivesMatching, pageHistory, steelsMatching } from '../../../queries/page-views';
import { presentPage, sendStale, sharedPage, withActions, type SharedPage } from './answers';
import {
  findPageOfType,
  findRevisionOf,
  linkCheckerFor,
  pageById,
  revisionById,
  listMethods,
} from '../../../queries/pages';
import {
  presentAbrasiveSummary,
  presentMethodSummary,
  presentPageEvent,
  presentRevision,
  presentRevisionSummary,
  presentSteelSummary,
} from '../../../presenters/pages';
import { createPage } from '../../../commands/create-page';
import { revisePage } from '../../../commands/revise-page';
import { reviewPageRevision } from '../../../commands/review-page-revision';
import { revertPage } from '../../../commands/revert-page';
import { protectPage } from '../../../commands/protect-page';
import { mergePages } from '../../../commands/merge-pages';


/**
 * The reference pages: steels, abrasives and methods, as lists (with filters) and one by one;
 * and the wiki on each: create (POST to the section), edit (PUT), history, one revision, revert, protect, merge; and the
 * review of proposed revisions.
 *
 * A merged page's slug answers GET with `301 Moved Permanently`, `Location:
 * /api/{section}/{survivor}` and a body `{ redirectTo, mergedInto: { slug, name } }` (not
 * cached, since a browser would otherwise remember it for good). Its history stays readable at
 * /api/{section}/{merged-slug}/revisions.
 */
export function pagesRouter(ctx: AppContext, answers: AnswerCache): Router {
  const router = Router();
  // A visitor's page or list answer depends on the pages and the approved results' figures only.
  const forVisitors = answers.keep('pages');
  // A page's answer but for the viewer's actions, computed once for everyone (signed in or not).
  const sharedPages = keptUntil<string, Promise<SharedPage>>('pages', { max: 2_000 });

  router.get('/steels', forVisitors, route({ query: steelListQuerySchema }, async (req, res) => {
    res.json({ items: (await steelsMatching(req.valid.query)).map((s) => presentSteelSummary(s.steel, s.resultCount)) });
  }));

  router.get('/abrasives', forVisitors, route({ query: abrasiveListQuerySchema }, async (req, res) => {
    res.json({ items: (await abrasivesMatching(req.valid.query)).map((a) => presentAbrasiveSummary(a.abrasive, a.resultCount)) });
  }));

  router.get('/methods', forVisitors, route({ query: emptyQuerySchema }, async (_req, res) => {
    const methods = await listMethods();
    const slugById = new Map(methods.map((m) => [m.id, m.slug]));
    res.json({ items: methods.map((m) => presentMethodSummary(m, slugById)) });
  }));

  for (const type of PAGE_TYPES) {
    const section = PAGE_SECTIONS[type];

    router.post(`/${section}`, requireUser, route({ body: pageCreateSchemas[type] }, async (req, res) => {
      const actor = actorOf(req)!;
      if (!can(actor, 'create:page')) throw forbidden('Only moderators and admins start new reference pages; propose changes to an existing page instead.');
      const created = await createPage(ctx, actor, type, req.valid.body);
      const page = await findPageOfType(type, created.page.slug);
      const revision = await findRevisionOf(type, page.id, created.revision.id);
      res
        .status(201)
        .location(`${req.baseUrl}/${section}/${page.slug}`)
        .json({ status: 'live', revision: presentRevision(revision, page, actor, await linkCheckerFor([revision.body])), page: await presentPage(type, page, actor) });
    }));

    router.get(`/${section}/:slug`, forVisitors, route({ params: slugParams }, async (req, res) => {
      const slug = req.valid.params.slug;
      const shared = await sharedPages.share(`${type}:${slug}`, () => sharedPage(type, slug));
      if ('moved' in shared) {
        const survivor = shared.moved;
        res
          .status(301)
          .set('Cache-Control', 'no-store')
          .location(`${req.baseUrl}/${section}/${survivor.slug}`)
          .json({ redirectTo: survivor.slug, mergedInto: { slug: survivor.slug, name: survivor.name } });
        return;
      }
      res.type('application/json').send(withActions(shared, actorOf(req)));
    }));

    router.put(`/${section}/:slug`, requireUser, route({ params: slugParams, body: pageEditSchemas[type] }, async (req, res) => {
      const actor = actorOf(req)!;
      const outcome = await revisePage(ctx, actor, type, req.valid.params.slug, req.valid.body);
      if (outcome.outcome === 'stale') return sendStale(res, outcome, actor);
      const revision = await findRevisionOf(type, outcome.page.id, outcome.revision.id);
      const page = await findPageOfType(type, outcome.page.slug);
      const linkExists = await linkCheckerFor([revision.body]);
      if (outcome.outcome === 'proposed') {
        res.status(202).json({ status: 'proposed', revision: presentRevision(revision, page, actor, linkExists) });
        return;
      }
      res.json({ status: 'live', revision: presentRevision(revision, page, actor, linkExists), page: await presentPage(type, page, actor) });
    }));

    router.get(`/${section}/:slug/revisions`, route({ params: slugParams }, async (req, res) => {
      const viewer = actorOf(req);
      const { page, mergedInto, revisions, events } = await pageHistory(type, req.valid.params.slug, viewer);
      res.json({
        page: {
          slug: page.slug,
          name: page.name,
          currentRevisionId: page.currentRevisionId,
          currentRevisionNumber: revisions.find((r) => r.id === page.currentRevisionId)?.number ?? null,
          isProtected: page.isProtected,
          mergedInto: mergedInto?.slug ?? null,
        },
        items: revisions.map((r) => presentRevisionSummary(r, page.currentRevisionId, viewer)),
        events: events.map(presentPageEvent),
      });
    }));

    router.get(`/${section}/:slug/revisions/:id`, route({ params: revisionParams }, async (req, res) => {
      const viewer = actorOf(req);
      const { slug, id } = req.valid.params;
      const page = await findPageOfType(type, slug);
      const revision = await findRevisionOf(type, page.id, id);
      if (!can(viewer, 'read:page-revision', { authorId: revision.authorId, status: revision.status })) throw notFound('Revision');
      res.json(presentRevision(revision, page, viewer, await linkCheckerFor([revision.body])));
    }));

    router.post(`/${section}/:slug/revert`, requireUser, route({ params: slugParams, body: pageRevertSchema }, async (req, res) => {
      const actor = actorOf(req)!;
      if (!can(actor, 'revert:page')) throw forbidden('Only moderators revert pages.');
      const outcome = await revertPage(ctx, actor, type, req.valid.params.slug, req.valid.body);
      if (outcome.outcome === 'stale') return sendStale(res, outcome, actor);
      const page = await findPageOfType(type, outcome.page.slug);
      const revision = await findRevisionOf(type, page.id, outcome.revision.id);
      res.json({ status: 'live', revision: presentRevision(revision, page, actor, await linkCheckerFor([revision.body])), page: await presentPage(type, page, actor) });
    }));

    router.post(`/${section}/:slug/protect`, requireUser, route({ params: slugParams, body: pageProtectSchema }, async (req, res) => {
      const actor = actorOf(req)!;
      if (!can(actor, 'protect:page')) throw forbidden('Only moderators protect pages.');
      const page = await protectPage(ctx, actor, type, req.valid.params.slug, req.valid.body);
      res.json(await presentPage(type, page, actor));
    }));

    router.post(`/${section}/:slug/merge`, requireUser, route({ params: slugParams, body: pageMergeSchema }, async (req, res) => {
      const actor = actorOf(req)!;
      if (!can(actor, 'merge:page')) throw forbidden('Only moderators merge pages.');
      const outcome = await mergePages(ctx, actor, type, req.valid.params.slug, req.valid.body);
      const survivor = await findPageOfType(type, outcome.target.slug);
      res.json({ merged: { slug: outcome.source.slug, name: outcome.source.name }, movedResults: outcome.movedResultIds.length, page: await presentPage(type, survivor, actor) });
    }));
  }

  router.post('/page-revisions/:id/review', requireUser, route({ params: idParams, body: pageReviewSchema }, async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('Only moderators review page edits.');
    const outcome = await reviewPageRevision(ctx, actor, req.valid.params.id, req.valid.body);
    const type = outcome.revision.pageType;
    const page = await findPageOfType(type, outcome.page.slug);
    if (outcome.outcome === 'conflict') {
      res.status(409).json({
        error: `The page changed since this edit was proposed, and both changed ${outcome.conflicts.join(', ')}. Nothing was saved; decline it with a note, or make the edit by hand.`,
        current: presentRevision(outcome.current, page, actor),
        conflicts: outcome.conflicts,
        merged: outcome.merged,
      });
      return;
    }
    const [revision, applied] = await Promise.all([findRevisionOf(type, page.id, outcome.revision.id), findRevisionOf(type, page.id, outcome.applied.id)]);
    res.json({
      status: revision.status,
      revision: presentRevision(revision, page, actor),
      applied: presentRevision(applied, page, actor),
    });
  }));

  router.get('/page-revisions/:id', route({ params: idParams }, async (req, res) => {
    const viewer = actorOf(req);
    const revision = await revisionById(req.valid.params.id);
    if (!revision || !can(viewer, 'read:page-revision', { authorId: revision.authorId, status: revision.status })) throw notFound('Revision');
    const page = await pageById(revision.pageType, revision.pageId);
    if (!page) throw notFound('Page');
    res.json(presentRevision(await findRevisionOf(revision.pageType, page.id, revision.id), page, viewer));
  }));

  return router;
}
