import { OAuth2Server } from 'oauth2-mock-server';

/**
 * The local OAuth2 provider that stands in for a hosted one outside production: a real
 * authorization-code round trip (oauth2-mock-server) in which the account signed in is the one
 * named by `login_hint`, or the default login. Each code may be exchanged once; a reused or
 * unknown code is refused, as a real provider would.
 */
export class LocalOAuthProvider {
  private readonly server = new OAuth2Server();
  private readonly codes = new Map<string, { login: string; used: boolean }>();

  constructor(private readonly defaultLogin: () => string | undefined) {
    const service = this.server.service;
    service.on('beforeAuthorizeRedirect', (redirect: { url: URL }, req: { query: Record<string, unknown> }) => {
      const code = redirect.url.searchParams.get('code');
      const hint = typeof req.query.login_hint === 'string' ? req.query.login_hint : undefined;
      const login = hint ?? this.defaultLogin();
      if (code && login) this.codes.set(code, { login, used: false });
    });
    service.on('beforeTokenSigning', (token: { payload: Record<string, unknown> }, req: { body?: Record<string, unknown> }) => {
      const entry = typeof req.body?.code === 'string' ? this.codes.get(req.body.code) : undefined;
      if (entry) token.payload.sub = entry.login;
    });
    service.on('beforeResponse', (response: { body: Record<string, unknown>; statusCode: number }, req: { body?: Record<string, unknown> }) => {
      if (req.body?.grant_type !== 'authorization_code') return;
      const entry = typeof req.body.code === 'string' ? this.codes.get(req.body.code) : undefined;
      if (!entry || entry.used) {
        response.statusCode = 400;
        response.body = { error: 'invalid_grant', error_description: 'unknown or already used code' };
        return;
      }
      entry.used = true;
    });
    service.on('beforeUserinfo', (response: { body: Record<string, unknown>; statusCode: number }, req: { headers: Record<string, string | undefined> }) => {
      const sub = subjectOf(req.headers.authorization);
      if (!sub) {
        response.statusCode = 401;
        response.body = { error: 'invalid_token' };
        return;
      }
      response.body = { sub, preferred_username: sub };
    });
  }

  /** Starts listening on loopback; returns the provider's base URL. */
  async start(port: number): Promise<string> {
    await this.server.issuer.keys.generate('RS256');
    await this.server.start(port, '127.0.0.1');
    const address = this.server.address();
    return `http://127.0.0.1:${address.port}`;
  }

  async stop(): Promise<void> {
    await this.server.stop();
  }
}

/** The `sub` claim of a Bearer JWT issued by this provider (signature checked by the provider's own endpoint use). */
function subjectOf(authorization: string | undefined): string | undefined {
  const token = authorization?.startsWith('Bearer ') ? authorization.slice(7) : undefined;
  const payload = token?.split('.')[1];
  if (!payload) return undefined;
  try {
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as { sub?: unknown };
    return typeof claims.sub === 'string' ? claims.sub : undefined;
  } catch {
    return undefined;
  }
}
