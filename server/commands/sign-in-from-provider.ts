import type { AppContext } from '../context';
import { User } from '../models';

/** Claims read from the provider's userinfo endpoint. */
export interface ProviderProfile {
  sub: string;
  preferredUsername?: string;
  name?: string;
  email?: string;
}

/**
 * Finds the account for a provider's subject, creating a member account the first time
 * someone signs in. Returns null for a banned account.
 */
export async function signInFromProvider(ctx: AppContext, profile: ProviderProfile): Promise<User | null> {
  const existing = await User.findOne({ where: { oauthSubject: profile.sub } });
  if (existing) return existing.banned ? null : existing;
  return ctx.db.write(async (transaction) => {
    const base = (profile.preferredUsername ?? profile.sub).toLowerCase().replace(/[^a-z0-9-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 30) || 'member';
    let handle = base;
    for (let i = 2; await User.findOne({ where: { handle }, transaction }); i += 1) handle = `${base}-${i}`;
    return User.create(
      { handle, displayName: profile.name ?? handle, email: profile.email ?? null, role: 'member', oauthSubject: profile.sub, bio: null },
      { transaction },
    );
  });
}
