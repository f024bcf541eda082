import type { Actor } from '@shared/permissions';
import type { ApiToken, PublisherApplication, Result, User } from '../models';
import { presentResult, type AbrasiveNames } from './result';
import { presentAccount } from './user';
import { presentApplication, presentToken } from './publishing';

/** A member's public profile as the API gives it: never an e-mail address. */
export function presentProfile<T extends { user: User; recent: Result[] }>({ user, recent, ...rest }: T, viewer: Actor | null, names: AbrasiveNames) {
  return { ...presentAccount(user), ...rest, recent: recent.map((r) => presentResult(r, viewer, names)) };
}

/** The member's own page as the API gives it. */
export function presentOwnPage<T extends OwnPageData>(page: T, names: AbrasiveNames) {
  const { user, badge, counts, drafts, pending, returned, rejected, following, notifications, tokens, application, imports, can } = page;
  const actor = user.asActor();
  const present = (rows: Result[]) => rows.map((r) => presentResult(r, actor, names));
  return {
    account: { ...presentAccount(user), hasEmail: !!user.email, badge },
    counts,
    drafts: present(drafts),
    pending: present(pending),
    returned: present(returned),
    rejected: present(rejected),
    following,
    notifications,
    tokens: tokens.map(presentToken),
    application: application ? presentApplication(application) : null,
    imports,
    can,
  };
}

/** What the own-page query reads (server/queries/profiles.ts ownPage). */
interface OwnPageData {
  user: User;
  badge: unknown;
  counts: unknown;
  drafts: Result[];
  pending: Result[];
  returned: Result[];
  rejected: Result[];
  following: unknown;
  notifications: unknown;
  tokens: ApiToken[];
  application: PublisherApplication | null;
  imports: unknown;
  can: unknown;
}
