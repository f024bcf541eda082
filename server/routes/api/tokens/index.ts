import { Router, type Request } from 'express';
import { can } from '@shared/permissions';
import { tokenCreateSchema } from '@shared/schemas/publishing';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { tokensOf } from '../../../queries/accounts';
import { createToken } from '../../../commands/create-token';
import { revokeToken } from '../../../commands/revoke-token';
import { presentToken } from '../../../presenters/publishing';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import { createdTokenSchema, type Presented } from '@shared/schemas/responses';


/** Token management needs the signed-in session: a leaked token must not mint or hide others. */
function requireSessionPublisher(req: Request) {
  if (!can(actorOf(req), 'manage:tokens')) throw forbidden('API tokens are for publishers.');
  if (req.authenticatedBy === 'token') throw forbidden('Manage API tokens from your signed-in session, not with a token.');
}

/** A publisher's API tokens: list, create (the token is shown once), revoke. */
export function tokensRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/tokens', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    requireSessionPublisher(req);
    const tokens = await tokensOf(actorOf(req)!.id);
    res.set('Cache-Control', 'no-store').json({ items: tokens.map(presentToken) });
  }));

  router.post('/tokens', requireUser, route({ body: tokenCreateSchema }, async (req, res) => {
    requireSessionPublisher(req);
    const { name } = req.valid.body;
    const { record, token } = await createToken(ctx, actorOf(req)!, name);
    res.status(201).set('Cache-Control', 'no-store').json({ ...presentToken(record), token } satisfies Presented<typeof createdTokenSchema>);
  }));

  router.delete('/tokens/:id', requireUser, route({ params: idParams }, async (req, res) => {
    requireSessionPublisher(req);
    const { id } = req.valid.params;
    await revokeToken(ctx, actorOf(req)!, id);
    res.status(204).end();
  }));

  return router;
}
