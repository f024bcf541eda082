import { ApiToken, PublisherApplication, User } from '../models';

/** Accounts not banned, by role then handle (the demo sign-in list). */
export function activeAccounts(): Promise<User[]> {
  return User.findAll({ where: { banned: false }, order: [['role', 'ASC'], ['handle', 'ASC']] });
}

/** The publishers not banned, by handle. */
export function publishers(): Promise<User[]> {
  return User.findAll({ where: { role: 'publisher', banned: false }, order: [['handle', 'ASC']] });
}

/** A member by handle, or null (a banned member too, with `banned` set). */
export function memberByHandle(handle: string): Promise<User | null> {
  return User.findOne({ where: { handle } });
}

/** One publisher application with its applicant and decider. */
export function applicationById(id: number): Promise<PublisherApplication | null> {
  return PublisherApplication.findByPk(id, { include: ['applicant', 'decidedBy'] });
}

/** Publisher applications, oldest first, optionally in one state. */
export function applications(status?: PublisherApplication['status']): Promise<PublisherApplication[]> {
  return PublisherApplication.findAll({ where: status ? { status } : {}, include: ['applicant', 'decidedBy'], order: [['createdAt', 'ASC']], limit: 500 });
}

/** A member's API tokens, newest first. */
export function tokensOf(userId: number): Promise<ApiToken[]> {
  return ApiToken.findAll({ where: { userId }, order: [['createdAt', 'DESC']] });
}
