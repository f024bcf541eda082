import type { EmailTopic } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { NotificationSetting, User } from '../models';
import { notFound } from '../errors';

/** Turns kinds of e-mail on or off for a member; returns the settings after the change. */
export async function updateNotificationSettings(ctx: AppContext, userId: number, changes: Partial<Record<EmailTopic, boolean>>): Promise<NotificationSetting> {
  return ctx.db.write(async (transaction) => {
    if (!(await User.findByPk(userId, { attributes: ['id'], transaction }))) throw notFound('That member');
    const [settings] = await NotificationSetting.findOrCreate({ where: { userId }, defaults: { userId, lastDigestAt: null }, transaction });
    await settings.update(changes, { transaction });
    return settings;
  });
}
