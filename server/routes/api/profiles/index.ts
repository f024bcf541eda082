import { Router } from 'express';
import type { Presented, profileSchema } from '@shared/schemas/responses';
import { handleParams } from '@shared/schemas/common';
import { actorOf } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { notFound } from '../../../errors';
import { memberByHandle } from '../../../queries/accounts';
import { abrasiveNames } from '../../../queries/compare-lookups';
import { publicProfile, resultsForExport } from '../../../queries/profiles';
import { resultsCsv } from '../../../presenters/result-csv';
import { presentProfile } from '../../../presenters/profile';

/** Public member profiles and each member's published results as CSV. */
export function profilesRouter(): Router {
  const router = Router();

  router.get('/profiles/:handle', route({ params: handleParams }, async (req, res) => {
    const { handle } = req.valid.params;
    res.json(presentProfile(await publicProfile(handle), actorOf(req), await abrasiveNames()) satisfies Presented<typeof profileSchema>);
  }));

  router.get('/profiles/:handle/results.csv', route({ params: handleParams }, async (req, res) => {
    const { handle } = req.valid.params;
    const user = await memberByHandle(handle);
    if (!user || user.banned) throw notFound('Member');
    res.type('text/csv; charset=utf-8').attachment(`edgeledger-${handle}-results.csv`).send(resultsCsv(await resultsForExport(user.id, false)));
  }));

  return router;
}
