import { Router } from 'express';
import type passport from 'passport';
import { z } from 'zod';
import type { AppContext } from '../../context';
import { route } from '../../middleware/validate';
import { csrfProtection } from '../../middleware/auth';
import { notFound } from '../../errors';
import { activeAccounts } from '../../queries/accounts';
import { presentAccount } from '../../presenters/user';
import { emptyQuerySchema } from '@shared/schemas/common';

/** A path inside this site, never another host ("//x" or "/\x" would leave it). */
const localPath = z
  .string()
  .max(500)
  .regex(/^\/(?![/\\])/, 'must be a path on this site')
  .optional();

const signinQuery = z.object({ as: z.string().max(40).optional(), returnTo: localPath }).strict();

/** Sign-in round trip with the OAuth2 provider, sign-out, and the demo accounts (not in production). */
export function authRouter(ctx: AppContext, auth: passport.PassportStatic): Router {
  const router = Router();

  router.get('/signin', route({ query: signinQuery }, (req, res, next) => {
    const { as, returnTo } = req.valid.query;
    if (as && ctx.env.isProduction) throw notFound('Demo sign-in');
    req.signinReturnTo = returnTo ?? '/';
    auth.authenticate('provider', { loginHint: as } as object)(req, res, next);
  }));

  router.get('/callback', (req, res, next) => {
    auth.authenticate('provider', { failureRedirect: '/sign-in?failed=1' } as object)(req, res, (err?: unknown) => {
      if (err) return next(err);
      res.redirect(req.signinReturnTo ?? '/');
    });
  });

  router.post('/signout', csrfProtection, route({}, (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie(ctx.env.isProduction ? '__Host-edgeledger' : 'edgeledger', { path: '/' });
        res.status(204).end();
      });
    });
  }));

  router.get('/demo-accounts', route({ query: emptyQuerySchema }, async (_req, res) => {
    if (ctx.env.isProduction) throw notFound('Demo accounts');
    const users = await activeAccounts();
    res.json(users.map(presentAccount));
  }));

  return router;
}
