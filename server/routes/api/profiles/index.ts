import { Router } from 'express';
import { z } from 'zod';
import { handleParams } from '@shared/schemas/common';
import { actorOf } from '../../../middleware/auth';
import { validate } from '../../../middleware/validate';
import { notFound } from '../../../errors';
import { memberByHandle } from '../../../queries/accounts';
import { publicProfile, resultsForExport } from '../../../queries/profiles';
import { resultsCsv } from '../../../presenters/result-csv';
import { presentProfile } from '../../../presenters/profile';

/** Public member profiles and each member's published results as CSV. */
export function profilesRouter(): Router {
  const router = Router();

  router.get('/profiles/:handle', validate({ params: handleParams }), async (req, res) => {
    const { handle } = req.valid.params as z.infer<typeof handleParams>;
    res.json(presentProfile(await publicProfile(handle), actorOf(req)));
  });

  router.get('/profiles/:handle/results.csv', validate({ params: handleParams }), async (req, res) => {
    const { handle } = req.valid.params as z.infer<typeof handleParams>;
    const user = await memberByHandle(handle);
    if (!user || user.banned) throw notFound('Member');
    res.type('text/csv; charset=utf-8').attachment(`edgeledger-${handle}-results.csv`).send(resultsCsv(await resultsForExport(user.id, false)));
  });

  return router;
}
