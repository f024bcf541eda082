import { Router, type Request, type Response } from 'express';
import type { z } from 'zod';
import { resultInputSchema, resultListQuerySchema, resultRevisionParams, reviewInputSchema, type ResultInput, type ReviewInput } from '@shared/schemas/result';
import type { AppContext } from '../../../context';
import type { User } from '../../../models';
import { actorOf, requireUser } from '../../../middleware/auth';
import { validate } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { can } from '@shared/permissions';
import { submitResult } from '../../../commands/submit-result';
import { reviewResult } from '../../../commands/review-result';
import { findResult, listResults } from '../../../queries/results';
import { presentPendingRevisions, presentResult, presentResultRevision } from '../../../presenters/result';
import { editResult, saveDraft } from '../../../commands/edit-result';
import { reviewResultRevision } from '../../../commands/review-result-revision';
import { pendingResultRevisions, resultRevisions } from '../../../queries/result-revisions';
import { setPageLinks } from '../../../presenters/page-links';
import { reviewDeskRevisions } from '../../../queries/pages';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import { bulkApproveSchema, retractInputSchema, reviewDeskQuerySchema, type ReviewDeskQuery } from '@shared/schemas/publishing';
import { openFlags, pendingImports, pendingResults } from '../../../queries/review-desk';
import { presentDeskResults, presentDeskRevisions, presentOpenFlags, presentPendingImports } from '../../../presenters/review-desk';
import { bulkApproveResults } from '../../../commands/bulk-approve-results';
import { retractResult } from '../../../commands/retract-result';

/** Results: post, list, read, review; and the review desk's queue. */
export function resultsRouter(ctx: AppContext): Router {
  const router = Router();

  router.post('/results', requireUser, validate({ body: resultInputSchema }), async (req, res) => {
    const author = req.user as User;
    res.status(201).json(presentResult(await submitResult(ctx, author, req.valid.body as ResultInput), actorOf(req)));
  });

  router.post('/results/drafts', requireUser, validate({ body: resultInputSchema }), async (req, res) => {
    res.status(201).json(presentResult(await saveDraft(ctx, req.user as User, req.valid.body as ResultInput), actorOf(req)));
  });

  // The author's edit: applied at once (200) before publication, a pending correction (202) after.
  const edit = (keepDraft: boolean) => async (req: Request, res: Response) => {
    const actor = actorOf(req)!;
    const { id } = req.valid.params as z.infer<typeof idParams>;
    const done = await editResult(ctx, actor, id, req.valid.body as ResultInput, { keepDraft });
    res.status(done.outcome === 'proposed' ? 202 : 200).json({
      outcome: done.outcome,
      result: presentResult(done.result, actor),
      revision: presentResultRevision(done.revision, { number: null, input: done.previous }),
    });
  };
  router.put('/results/:id', requireUser, validate({ params: idParams, body: resultInputSchema }), edit(false));
  router.put('/results/:id/draft', requireUser, validate({ params: idParams, body: resultInputSchema }), edit(true));

  router.get('/results/:id/revisions', validate({ params: idParams, query: emptyQuerySchema }), async (req, res) => {
    const { id } = req.valid.params as z.infer<typeof idParams>;
    res.json({ items: (await resultRevisions(id, actorOf(req))).map(({ revision, replaces }) => presentResultRevision(revision, replaces)) });
  });

  router.post('/results/:id/revisions/:rev/review', requireUser, validate({ params: resultRevisionParams, body: reviewInputSchema }), async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('Only moderators review corrections.');
    const { id, rev } = req.valid.params as z.infer<typeof resultRevisionParams>;
    const done = await reviewResultRevision(ctx, req.user as User, id, rev, req.valid.body as ReviewInput);
    res.json({ result: presentResult(done.result, actor), revision: presentResultRevision(done.revision, null) });
  });

  router.get('/results', validate({ query: resultListQuerySchema }), async (req, res) => {
    const viewer = actorOf(req);
    const page = await listResults(req.valid.query as z.infer<typeof resultListQuerySchema>, viewer);
    setPageLinks(req, res, page).json({ ...page, items: page.items.map((r) => presentResult(r, viewer)) });
  });

  router.get('/results/:id', validate({ params: idParams }), async (req, res) => {
    const viewer = actorOf(req);
    const { id } = req.valid.params as z.infer<typeof idParams>;
    res.json(presentResult(await findResult(id, viewer), viewer));
  });

  router.post('/results/:id/review', requireUser, validate({ params: idParams, body: reviewInputSchema }), async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('Only moderators review results.');
    const { id } = req.valid.params as z.infer<typeof idParams>;
    res.json(presentResult(await reviewResult(ctx, req.user as User, id, req.valid.body as ReviewInput), actor));
  });

  router.get('/review-desk', requireUser, validate({ query: reviewDeskQuerySchema }), async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('The review desk is for moderators.');
    const filters = req.valid.query as ReviewDeskQuery;
    const show = (kind: ReviewDeskQuery['kind']) => !filters.kind || filters.kind === kind;
    // `revisions`: proposed page edits (kind 'page-revision'), beside the results in `items`;
    // `flags`: open flags; `imports`: publishers' imports with results still pending.
    res.json({
      items: show('result') ? presentDeskResults(await pendingResults(filters), actor) : [],
      revisions: show('page-revision') ? presentDeskRevisions(await reviewDeskRevisions(), actor) : [],
      flags: show('flag') ? presentOpenFlags(await openFlags(filters)) : [],
      imports: show('result') ? presentPendingImports(await pendingImports()) : [],
      // Corrections of published results, each with the changes against the published version.
      resultRevisions: show('result') ? presentPendingRevisions(await pendingResultRevisions(), actor) : [],
    });
  });

  router.post('/review-desk/bulk-approve', requireUser, validate({ body: bulkApproveSchema }), async (req, res) => {
    res.json(await bulkApproveResults(ctx, actorOf(req)!, req.valid.body as z.infer<typeof bulkApproveSchema>));
  });

  router.post('/results/:id/retract', requireUser, validate({ params: idParams, body: retractInputSchema }), async (req, res) => {
    const actor = actorOf(req)!;
    const { id } = req.valid.params as z.infer<typeof idParams>;
    res.json(presentResult(await retractResult(ctx, actor, id, (req.valid.body as z.infer<typeof retractInputSchema>).reason), actor));
  });

  return router;
}
