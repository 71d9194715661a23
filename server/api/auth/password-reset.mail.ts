import type { MailMessage } from '../../common/mail.js';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function passwordResetMessage(to: string, displayName: string, link: string, expiresAt: Date): MailMessage {
  const expires = expiresAt.toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
  const text = [
    `${displayName}, someone asked to set a new Tallyvolt password for this address.`,
    '',
    `Set a new password here (the link works once, until ${expires}):`,
    link,
    '',
    'Setting it signs you out everywhere. If you did not ask for this, ignore this message: your password stays as it is.',
  ].join('\n');
  const html =
    `<p>${escapeHtml(displayName)}, someone asked to set a new Tallyvolt password for this address.</p>` +
    `<p><a href="${escapeHtml(link)}">Set a new password</a> (the link works once, until ${expires}).</p>` +
    `<p>Setting it signs you out everywhere. If you did not ask for this, ignore this message: your password stays as it is.</p>`;
  return { to, subject: 'Set a new Tallyvolt password', text, html };
}
