import { can, type Actor } from '@shared/permissions';
import type { SiteSettings } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { forbidden } from '../errors';
import { SiteSetting } from '../models';
import { siteSettings } from '../queries/site-settings';
import { recordAudit } from './record-audit';

/** An admin changes site settings; each changed value is audited with its old and new value. */
export async function updateSiteSettings(ctx: AppContext, actor: Actor, changes: Partial<SiteSettings>): Promise<SiteSettings> {
  if (!can(actor, 'manage:site-settings')) throw forbidden('Only admins change site settings.');
  return ctx.db.write(async (transaction) => {
    const before = await siteSettings(transaction);
    for (const [key, value] of Object.entries(changes) as [keyof SiteSettings, SiteSettings[keyof SiteSettings]][]) {
      if (before[key] === value) continue;
      await SiteSetting.upsert({ key, value, updatedAt: new Date() }, { transaction });
      await recordAudit(actor, { action: 'site-settings.update', subjectType: 'site-settings', details: { key, from: before[key], to: value } }, transaction);
    }
    return siteSettings(transaction);
  });
}
