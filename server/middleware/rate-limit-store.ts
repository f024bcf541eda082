import { Op } from 'sequelize';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Database } from '../db/database';
import { RateLimitCount } from '../models';

/** How often a process removes the counts whose window has ended. */
const SWEEP_MS = 60_000;

/**
 * An express-rate-limit store over the `rate_limit_counts` table (migration 0013), so a limit
 * counts a client's requests across every app process on one PostgreSQL database. Each count is
 * read and written in one write (SERIALIZABLE on PostgreSQL, run again on a conflict), so two
 * processes counting the same client at once never lose a hit. Counts whose window ended are
 * started again by the next hit, and removed once a minute.
 */
export class DatabaseRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;
  private sweptAt = 0;

  constructor(
    private readonly db: Database,
    /** The limit's name, so two limits keep apart counts for one client. */
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(client: string): string {
    return `${this.prefix}:${client}`;
  }

  async get(client: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await RateLimitCount.findByPk(this.key(client));
    return row && row.resetAt.getTime() > Date.now() ? { totalHits: row.hits, resetTime: row.resetAt } : undefined;
  }

  async increment(client: string): Promise<ClientRateLimitInfo> {
    const key = this.key(client);
    const sweep = Date.now() - this.sweptAt >= SWEEP_MS;
    if (sweep) this.sweptAt = Date.now();
    return this.db.write(async (transaction) => {
      const now = new Date();
      if (sweep) await RateLimitCount.destroy({ where: { resetAt: { [Op.lte]: now } }, transaction });
      const row = await RateLimitCount.findByPk(key, { transaction });
      const current = row && row.resetAt > now ? { hits: row.hits + 1, resetAt: row.resetAt } : { hits: 1, resetAt: new Date(now.getTime() + this.windowMs) };
      await RateLimitCount.upsert({ key, ...current }, { transaction });
      return { totalHits: current.hits, resetTime: current.resetAt };
    });
  }

  async decrement(client: string): Promise<void> {
    await this.db.write(async (transaction) => {
      const row = await RateLimitCount.findByPk(this.key(client), { transaction });
      if (row && row.hits > 0 && row.resetAt > new Date()) await row.update({ hits: row.hits - 1 }, { transaction });
    });
  }

  async resetKey(client: string): Promise<void> {
    await this.db.write((transaction) => RateLimitCount.destroy({ where: { key: this.key(client) }, transaction }));
  }
}
