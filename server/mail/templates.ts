/**
 * E-mail bodies: every message is written once as content and rendered to a plain-text part
 * and an HTML part, both ending with the unsubscribe link that works without signing in.
 */

/** What one message says. Paragraphs are plain text; links are listed separately. */
export interface EmailContent {
  subject: string;
  greeting: string;
  paragraphs: string[];
  /** A quoted note (a moderator's note or reason), shown set apart. */
  quote?: { label: string; text: string };
  /** Items with links, e.g. the results of a digest. */
  items?: { text: string; url: string }[];
  action?: { label: string; url: string };
}

/** The unsubscribe line: which kind of mail, and the link that turns it off. */
export interface UnsubscribeFooter {
  topicLabel: string;
  url: string;
  settingsUrl: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** Renders content to the plain-text and HTML parts of one message. */
export function renderEmail(content: EmailContent, footer: UnsubscribeFooter): { subject: string; text: string; html: string } {
  const text: string[] = [content.greeting, ''];
  for (const p of content.paragraphs) text.push(p, '');
  if (content.quote) text.push(`${content.quote.label}:`, ...content.quote.text.split('\n').map((l) => `> ${l}`), '');
  if (content.items?.length) {
    for (const item of content.items) text.push(`- ${item.text}`, `  ${item.url}`);
    text.push('');
  }
  if (content.action) text.push(`${content.action.label}: ${content.action.url}`, '');
  text.push('--', `You receive this because "${footer.topicLabel}" is on in your Edgeledger e-mail settings.`);
  text.push(`Unsubscribe (no sign-in needed): ${footer.url}`, `All e-mail settings: ${footer.settingsUrl}`);

  const html: string[] = [
    '<!doctype html><html><body style="font-family: Georgia, serif; color: #222; line-height: 1.5; max-width: 36em">',
    `<p>${escapeHtml(content.greeting)}</p>`,
    ...content.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
  ];
  if (content.quote) {
    html.push(`<p><strong>${escapeHtml(content.quote.label)}:</strong></p><blockquote style="border-left: 3px solid #999; margin: 0; padding-left: 1em">${escapeHtml(content.quote.text).replace(/\n/g, '<br>')}</blockquote>`);
  }
  if (content.items?.length) {
    html.push(`<ul>${content.items.map((i) => `<li><a href="${escapeHtml(i.url)}">${escapeHtml(i.text)}</a></li>`).join('')}</ul>`);
  }
  if (content.action) html.push(`<p><a href="${escapeHtml(content.action.url)}">${escapeHtml(content.action.label)}</a></p>`);
  html.push(
    `<hr><p style="font-size: 0.85em; color: #555">You receive this because “${escapeHtml(footer.topicLabel)}” is on in your Edgeledger e-mail settings. ` +
      `<a href="${escapeHtml(footer.url)}">Unsubscribe</a> (no sign-in needed) · <a href="${escapeHtml(footer.settingsUrl)}">All e-mail settings</a></p>`,
    '</body></html>',
  );
  return { subject: content.subject, text: text.join('\n'), html: html.join('\n') };
}
