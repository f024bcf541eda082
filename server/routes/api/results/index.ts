import { Router } from 'express';
import { resultInputSchema, resultListQuerySchema, resultRevisionParams, reviewInputSchema } from '@shared/schemas/result';
import type { AppContext } from '../../../context';
import type { User } from '../../../models';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { can } from '@shared/permissions';
import { submitResult } from '../../../commands/submit-result';
import { reviewResult } from '../../../commands/review-result';
import { findResult, listResults } from '../../../queries/results';
import { abrasiveNames } from '../../../queries/compare-lookups';
import { presentPendingRevisions, presentResult, presentResultRevision, presentResultSummary } from '../../../presenters/result';
import { editResult, saveDraft } from '../../../commands/edit-result';
import { reviewResultRevision } from '../../../commands/review-result-revision';
import { pendingResultRevisions, resultRevisions } from '../../../queries/result-revisions';
import { setPageLinks } from '../../../presenters/page-links';
import { reviewDeskRevisions } from '../../../queries/pages';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import { bulkApproveSchema, retractInputSchema, reviewDeskQuerySchema, type ReviewDeskQuery } from '@shared/schemas/publishing';
import { bulkApprovalSchema, reviewDeskSchema, type Presented } from '@shared/schemas/responses';
import { openFlags, pendingImports, pendingResults } from '../../../queries/review-desk';
import { presentDeskContext, presentDeskResults, presentDeskRevisions, presentOpenFlags, presentPendingImports } from '../../../presenters/review-desk';
import { deskContext } from '../../../queries/desk-context';
import { bulkApproveResults } from '../../../commands/bulk-approve-results';
import { retractResult } from '../../../commands/retract-result';

/** Results: post, list, read, review; and the review desk's queue. */
export function resultsRouter(ctx: AppContext): Router {
  const router = Router();

  router.post('/results', requireUser, route({ body: resultInputSchema }, async (req, res) => {
    const author = req.user as User;
    res.status(201).json(presentResult(await submitResult(ctx, author, req.valid.body), actorOf(req), await abrasiveNames()));
  }));

  router.post('/results/drafts', requireUser, route({ body: resultInputSchema }, async (req, res) => {
    res.status(201).json(presentResult(await saveDraft(ctx, req.user as User, req.valid.body), actorOf(req), await abrasiveNames()));
  }));

  // The author's edit: applied at once (200) before publication, a pending correction (202) after.
  const edit = (keepDraft: boolean) =>
    route({ params: idParams, body: resultInputSchema }, async (req, res) => {
      const actor = actorOf(req)!;
      const { id } = req.valid.params;
      const done = await editResult(ctx, actor, id, req.valid.body, { keepDraft });
      res.status(done.outcome === 'proposed' ? 202 : 200).json({
        outcome: done.outcome,
        result: presentResult(done.result, actor, await abrasiveNames()),
        revision: presentResultRevision(done.revision, { number: null, input: done.previous }),
      });
    });
  router.put('/results/:id', requireUser, edit(false));
  router.put('/results/:id/draft', requireUser, edit(true));

  router.get('/results/:id/revisions', route({ params: idParams, query: emptyQuerySchema }, async (req, res) => {
    const { id } = req.valid.params;
    res.json({ items: (await resultRevisions(id, actorOf(req))).map(({ revision, replaces }) => presentResultRevision(revision, replaces)) });
  }));

  router.post('/results/:id/revisions/:rev/review', requireUser, route({ params: resultRevisionParams, body: reviewInputSchema }, async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('Only moderators review corrections.');
    const { id, rev } = req.valid.params;
    const done = await reviewResultRevision(ctx, req.user as User, id, rev, req.valid.body);
    res.json({ result: presentResult(done.result, actor, await abrasiveNames()), revision: presentResultRevision(done.revision, null) });
  }));

  router.get('/results', route({ query: resultListQuerySchema }, async (req, res) => {
    const viewer = actorOf(req);
    const page = await listResults(req.valid.query, viewer);
    setPageLinks(req, res, page).json({ ...page, items: page.items.map((r) => presentResultSummary(r, viewer)) });
  }));

  router.get('/results/:id', route({ params: idParams }, async (req, res) => {
    const viewer = actorOf(req);
    const { id } = req.valid.params;
    res.json(presentResult(await findResult(id, viewer), viewer, await abrasiveNames()));
  }));

  router.post('/results/:id/review', requireUser, route({ params: idParams, body: reviewInputSchema }, async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('Only moderators review results.');
    const { id } = req.valid.params;
    res.json(presentResult(await reviewResult(ctx, req.user as User, id, req.valid.body), actor, await abrasiveNames()));
  }));

  router.get('/review-desk', requireUser, route({ query: reviewDeskQuerySchema }, async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('The review desk is for moderators.');
    const filters = req.valid.query;
    const show = (kind: ReviewDeskQuery['kind']) => !filters.kind || filters.kind === kind;
    // `revisions`: proposed page edits (kind 'page-revision'), beside the results in `items`;
    // `flags`: open flags; `imports`: publishers' imports with results still pending.
    res.json({
      items: show('result') ? presentDeskResults(await pendingResults(filters), actor, await abrasiveNames()) : [],
      revisions: show('page-revision') ? presentDeskRevisions(await reviewDeskRevisions(), actor) : [],
      flags: show('flag') ? presentOpenFlags(await openFlags(filters)) : [],
      imports: show('result') ? presentPendingImports(await pendingImports()) : [],
      // Corrections of published results, each with the changes against the published version.
      resultRevisions: show('result') ? presentPendingRevisions(await pendingResultRevisions(), actor, await abrasiveNames()) : [],
    } satisfies Presented<typeof reviewDeskSchema>);
  }));

  // One pending result's context: its cell and place there, the outlier hint, readings, near-duplicates, the author's record.
  router.get('/review-desk/results/:id/context', requireUser, route({ params: idParams, query: emptyQuerySchema }, async (req, res) => {
    if (!can(actorOf(req)!, 'read:review-desk')) throw forbidden('The review desk is for moderators.');
    res.json(presentDeskContext(await deskContext(req.valid.params.id)));
  }));

  router.post('/review-desk/bulk-approve', requireUser, route({ body: bulkApproveSchema }, async (req, res) => {
    res.json((await bulkApproveResults(ctx, actorOf(req)!, req.valid.body)) satisfies Presented<typeof bulkApprovalSchema>);
  }));

  router.post('/results/:id/retract', requireUser, route({ params: idParams, body: retractInputSchema }, async (req, res) => {
    const actor = actorOf(req)!;
    const { id } = req.valid.params;
    res.json(presentResult(await retractResult(ctx, actor, id, req.valid.body.reason), actor, await abrasiveNames()));
  }));

  return router;
}
