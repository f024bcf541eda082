import type { Transaction } from 'sequelize';
import type { SiteSettings } from '@shared/schemas/publishing';
import { SiteSetting } from '../models';

/** Settings an admin has not set take these values. */
export const SITE_SETTING_DEFAULTS: SiteSettings = { trustPublisherImports: false };

/** The site settings, defaults filled in. */
export async function siteSettings(transaction?: Transaction): Promise<SiteSettings> {
  const rows = await SiteSetting.findAll({ transaction });
  const stored = Object.fromEntries(rows.map((r) => [r.key, r.value]));
  return { ...SITE_SETTING_DEFAULTS, ...(stored as Partial<SiteSettings>) };
}
