import { Op } from 'sequelize';
import type { AppContext } from '../context';
import { Abrasive, Follow, NotificationSetting, Result, Steel, User } from '../models';
import { notifyMember, wantsMail } from '../mail/notify-member';

const WEEK_MS = 7 * 24 * 3600 * 1000;
/** Results listed in one digest; the rest are counted. */
const LISTED = 30;

/** What one run of the digest did. */
export interface DigestRun {
  followers: number;
  sent: number;
  results: number;
}

/**
 * The weekly digest: each member who follows steel or abrasive pages, and has the digest on,
 * gets one message listing the results approved on those pages since their last digest (at
 * most a week back). Members with nothing new get nothing. Run by `npm run digest`.
 */
export async function sendDigest(ctx: Pick<AppContext, 'env' | 'db' | 'mailer' | 'baseUrl'>, now = new Date()): Promise<DigestRun> {
  const follows = await Follow.findAll();
  const byUser = new Map<number, { steels: number[]; abrasives: number[] }>();
  for (const f of follows) {
    const entry = byUser.get(f.userId) ?? { steels: [], abrasives: [] };
    (f.pageType === 'steel' ? entry.steels : entry.abrasives).push(f.pageId);
    byUser.set(f.userId, entry);
  }
  const run: DigestRun = { followers: byUser.size, sent: 0, results: 0 };
  for (const [userId, pages] of byUser) {
    const user = await User.findByPk(userId);
    if (!user || user.banned || !user.email || !(await wantsMail(userId, 'digest'))) continue;
    const settings = await NotificationSetting.findByPk(userId);
    const since = new Date(Math.max(settings?.lastDigestAt?.getTime() ?? 0, now.getTime() - WEEK_MS));
    const where = {
      status: 'approved' as const,
      approvedAt: { [Op.gt]: since, [Op.lte]: now },
      [Op.or]: [
        ...(pages.steels.length ? [{ steelId: { [Op.in]: pages.steels } }] : []),
        ...(pages.abrasives.length ? [{ abrasiveId: { [Op.in]: pages.abrasives } }] : []),
      ],
    };
    const { rows, count } = await Result.findAndCountAll({
      where,
      include: [{ model: Steel, as: 'steel' }, { model: Abrasive, as: 'abrasive' }],
      order: [['approvedAt', 'DESC']],
      limit: LISTED,
    });
    if (!count) continue;
    const followed = [
      ...(await Steel.findAll({ where: { id: pages.steels }, attributes: ['name'] })).map((s) => s.name),
      ...(await Abrasive.findAll({ where: { id: pages.abrasives }, attributes: ['name'] })).map((a) => a.name),
    ];
    const sent = await notifyMember(ctx, user, 'digest', {
      subject: `Edgeledger digest: ${count} new result${count === 1 ? '' : 's'} on pages you follow`,
      greeting: `Hello ${user.displayName},`,
      paragraphs: [
        `Since ${since.toISOString().slice(0, 10)}, ${count} result${count === 1 ? ' was' : 's were'} published on the pages you follow (${followed.join(', ')}).`,
        ...(count > rows.length ? [`The newest ${rows.length} are listed; the pages show them all.`] : []),
      ],
      items: rows.map((r) => ({
        text: `#${r.id}: ${r.steel?.name ?? ''} at ${Math.round(r.hrc * 10) / 10} HRC on ${r.abrasive?.name ?? ''}, ${Math.round(r.perSideDeg * 10) / 10}° per side, median ${Math.round(r.sharpnessMedianG)} g`,
        url: `${ctx.baseUrl}/results/${r.id}`,
      })),
      action: { label: 'Pages you follow', url: `${ctx.baseUrl}/me#following` },
    });
    if (!sent) continue;
    run.sent += 1;
    run.results += count;
    await ctx.db.write(async (transaction) => {
      const [row] = await NotificationSetting.findOrCreate({ where: { userId }, defaults: { userId, lastDigestAt: null }, transaction });
      await row.update({ lastDigestAt: now }, { transaction });
    });
  }
  return run;
}
