import { EMAIL_TOPICS, type EmailTopic } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { NotificationSetting, type User } from '../models';
import { renderEmail, type EmailContent } from './templates';
import { unsubscribeQuery } from './unsubscribe';

/** Whether `user` wants mail of `topic` (no settings row: every kind is on). */
export async function wantsMail(userId: number, topic: EmailTopic): Promise<boolean> {
  const settings = await NotificationSetting.findByPk(userId);
  return settings ? settings.wants(topic) : true;
}

/**
 * Sends one message of `topic` to a member, unless they have no address or turned that kind
 * of mail off. Every message carries a plain-text and an HTML part, a signed unsubscribe link
 * (a page that needs no sign-in) and the one-click List-Unsubscribe headers (RFC 8058).
 * Resolves true when a message was handed to the SMTP server.
 */
export async function notifyMember(ctx: Pick<AppContext, 'env' | 'mailer' | 'baseUrl'>, user: User, topic: EmailTopic, content: EmailContent): Promise<boolean> {
  if (!user.email || user.banned) return false;
  if (!(await wantsMail(user.id, topic))) return false;
  const query = unsubscribeQuery(ctx.env, user.id, topic);
  const message = renderEmail(content, {
    topicLabel: EMAIL_TOPICS[topic],
    url: `${ctx.baseUrl}/unsubscribe?${query}`,
    settingsUrl: `${ctx.baseUrl}/me#e-mail`,
  });
  await ctx.mailer.send({
    to: user.email,
    ...message,
    headers: {
      'List-Unsubscribe': `<${ctx.baseUrl}/api/me/unsubscribe?${query}>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
  });
  return true;
}
