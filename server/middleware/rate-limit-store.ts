import { fn, col, Op } from 'sequelize';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Database } from '../db/database';
import { RateLimitHit } from '../models';

/** How often a process removes the hits older than the window. */
const SWEEP_MS = 60_000;

/**
 * An express-rate-limit store over the `rate_limit_hits` table (migration 0013), so a limit counts
 * a client's requests across every app process on one PostgreSQL database. Each counted request
 * is a row of its own, written alone (an insert conflicts with nothing, where one counter row
 * made a client's simultaneous requests fail each other's SERIALIZABLE transactions past their
 * retries); the count is then read: the client's hits in the last window (a sliding window), its
 * reset when the oldest of them leaves it. Hits older than the window are removed once a minute.
 */
export class DatabaseRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;
  private sweptAt = Date.now();

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
    const since = new Date(Date.now() - this.windowMs);
    const [row] = (await RateLimitHit.findAll({
      attributes: [
        [fn('COUNT', col('id')), 'hits'],
        [fn('MIN', col('at')), 'oldest'],
      ],
      where: { key: this.key(client), at: { [Op.gt]: since } },
      raw: true,
    })) as unknown as { hits: number | string; oldest: Date | string | null }[];
    const hits = Number(row?.hits ?? 0);
    return hits ? { totalHits: hits, resetTime: new Date(new Date(row.oldest!).getTime() + this.windowMs) } : undefined;
  }

  async increment(client: string): Promise<ClientRateLimitInfo> {
    const now = Date.now();
    const sweep = now - this.sweptAt >= SWEEP_MS;
    if (sweep) this.sweptAt = now;
    await this.db.write(async (transaction) => {
      await RateLimitHit.create({ key: this.key(client), at: new Date(now) }, { transaction });
    });
    if (sweep) await this.db.write((transaction) => RateLimitHit.destroy({ where: { at: { [Op.lte]: new Date(now - this.windowMs) } }, transaction }));
    return (await this.get(client)) ?? { totalHits: 1, resetTime: new Date(now + this.windowMs) };
  }

  /** Takes back the client's newest hit (a request the limit does not count after all). */
  async decrement(client: string): Promise<void> {
    await this.db.write(async (transaction) => {
      const newest = await RateLimitHit.findOne({ where: { key: this.key(client) }, order: [['id', 'DESC']], transaction });
      await newest?.destroy({ transaction });
    });
  }

  async resetKey(client: string): Promise<void> {
    await this.db.write((transaction) => RateLimitHit.destroy({ where: { key: this.key(client) }, transaction }));
  }
}
