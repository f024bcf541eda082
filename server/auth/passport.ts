import passport from 'passport';
import OAuth2Strategy, { type VerifyCallback } from 'passport-oauth2';
import type { AppContext } from '../context';
import type { Database } from '../db/database';
import type { InferAttributes } from 'sequelize';
import { User } from '../models';
import { keptUntil } from '../queries/kept-until';
import { signInFromProvider, type ProviderProfile } from '../commands/sign-in-from-provider';
import { SignInStateStore } from './sign-in-state';

/** passport-oauth2 with the userinfo call it lacks, and `login_hint` passed through. */
class ProviderStrategy extends OAuth2Strategy {
  constructor(
    private readonly userinfoUrl: string,
    options: OAuth2Strategy.StrategyOptions,
    verify: OAuth2Strategy.VerifyFunction,
  ) {
    super(options, verify);
    this.name = 'provider';
  }

  override userProfile(accessToken: string, done: (err?: unknown, profile?: ProviderProfile) => void): void {
    fetch(this.userinfoUrl, { headers: { Authorization: `Bearer ${accessToken}` } })
      .then(async (res) => {
        if (!res.ok) throw new Error(`userinfo answered ${res.status}`);
        const claims = (await res.json()) as Record<string, unknown>;
        if (typeof claims.sub !== 'string') throw new Error('userinfo gave no subject');
        done(null, {
          sub: claims.sub,
          preferredUsername: typeof claims.preferred_username === 'string' ? claims.preferred_username : undefined,
          name: typeof claims.name === 'string' ? claims.name : undefined,
          email: typeof claims.email === 'string' ? claims.email : undefined,
        });
      })
      .catch((err) => done(err));
  }

  override authorizationParams(options: { loginHint?: string }): object {
    return options.loginHint ? { login_hint: options.loginHint } : {};
  }
}

/**
 * Accounts by id, as their fields, kept until any account is written (a ban, a role, a new
 * member): every signed-in request reads one, and a ban still takes effect on the next request
 * after its commit. Each request gets a User of its own, so nothing a handler does to it leaks.
 * Kept on SQLite only, where one process makes every write: on PostgreSQL another process may
 * ban, and this one would hear of it only at its next poll of the change feed, so each
 * request reads the account, as it reads its session there.
 */
const accounts = keptUntil<number, InferAttributes<User> | null>('accounts');

async function findAccount(db: Database, id: number): Promise<User | null> {
  if (!db.isSqlite) return User.findByPk(id);
  const fields = await accounts.read(id, async () => ((await User.findByPk(id))?.get({ plain: true }) as InferAttributes<User> | undefined) ?? null);
  return fields ? User.build(fields, { isNewRecord: false }) : null;
}

/** Configures passport: the provider strategy and session (de)serialisation by user id. */
export function configurePassport(ctx: AppContext): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use(
    new ProviderStrategy(
      ctx.oauth.userinfoUrl,
      {
        authorizationURL: ctx.oauth.authorizeUrl,
        tokenURL: ctx.oauth.tokenUrl,
        clientID: ctx.oauth.clientId,
        clientSecret: ctx.oauth.clientSecret,
        // Relative: passport-oauth2 resolves it against the request's own origin.
        callbackURL: ctx.env.PUBLIC_URL ? `${ctx.env.PUBLIC_URL}/auth/callback` : '/auth/callback',
        pkce: true,
        store: new SignInStateStore(ctx.db, ctx.env.isProduction) as unknown as OAuth2Strategy.StateStore,
        scope: ['openid', 'profile'],
      },
      (_accessToken: string, _refreshToken: string, profile: ProviderProfile, done: VerifyCallback) => {
        signInFromProvider(ctx, profile)
          .then((user) => (user ? done(null, user) : done(null, false, { message: 'This account is suspended.' })))
          .catch((err) => done(err));
      },
    ),
  );
  instance.serializeUser((user, done) => done(null, (user as User).id));
  instance.deserializeUser((id: number, done) => {
    findAccount(ctx.db, id)
      .then((user) => done(null, user && !user.banned ? user : false))
      .catch((err) => done(err));
  });
  return instance;
}
