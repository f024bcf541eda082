import type { Actor } from '@shared/permissions';
import type { FollowablePage } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { notFound } from '../errors';
import { Abrasive, Follow, Steel } from '../models';

async function pageIdOf(pageType: FollowablePage, slug: string): Promise<number> {
  const page = pageType === 'steel' ? await Steel.findOne({ where: { slug }, attributes: ['id'] }) : await Abrasive.findOne({ where: { slug }, attributes: ['id'] });
  if (!page) throw notFound(`The ${pageType} page`);
  return page.id;
}

/** The member follows a steel or abrasive page (for the weekly digest). Idempotent. */
export async function followPage(ctx: AppContext, actor: Actor, pageType: FollowablePage, slug: string): Promise<void> {
  const pageId = await pageIdOf(pageType, slug);
  await ctx.db.write(async (transaction) => {
    const existing = await Follow.findOne({ where: { userId: actor.id, pageType, pageId }, transaction });
    if (!existing) await Follow.create({ userId: actor.id, pageType, pageId }, { transaction });
  });
}

/** The member stops following a page. Idempotent. */
export async function unfollowPage(ctx: AppContext, actor: Actor, pageType: FollowablePage, slug: string): Promise<void> {
  const pageId = await pageIdOf(pageType, slug);
  await ctx.db.write((transaction) => Follow.destroy({ where: { userId: actor.id, pageType, pageId }, transaction }));
}
