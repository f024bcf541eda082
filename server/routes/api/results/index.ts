import { Router } from 'express';
import { z } from 'zod';
import { resultInputSchema, resultListQuerySchema, reviewInputSchema, type ResultInput, type ReviewInput } from '@shared/schemas/result';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { validate } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { can } from '@shared/permissions';
import { submitResult } from '../../../commands/submit-result';
import { reviewResult } from '../../../commands/review-result';
import { findResult, listResults, reviewQueue } from '../../../queries/results';
import { presentResult } from '../../../presenters/result';

const idParams = z.object({ id: z.coerce.number().int().positive() }).strict();

/** Results: post, list, read, review; and the review desk's queue. */
export function resultsRouter(ctx: AppContext): Router {
  const router = Router();

  router.post('/results', requireUser, validate({ body: resultInputSchema }), async (req, res) => {
    const actor = actorOf(req)!;
    const result = await submitResult(ctx, actor, req.valid.body as ResultInput);
    res.status(201).json(presentResult(await findResult(result.id, actor), actor));
  });

  router.get('/results', validate({ query: resultListQuerySchema }), async (req, res) => {
    const viewer = actorOf(req);
    const page = await listResults(req.valid.query as z.infer<typeof resultListQuerySchema>, viewer);
    res.json({ ...page, items: page.items.map((r) => presentResult(r, viewer)) });
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
    await reviewResult(ctx, actor, id, req.valid.body as ReviewInput);
    res.json(presentResult(await findResult(id, actor), actor));
  });

  router.get('/review-desk', requireUser, async (req, res) => {
    const actor = actorOf(req)!;
    if (!can(actor, 'read:review-desk')) throw forbidden('The review desk is for moderators.');
    res.json({ items: (await reviewQueue()).map((r) => presentResult(r, actor)) });
  });

  return router;
}
