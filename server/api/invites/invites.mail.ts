import type { Role } from '../../../shared/schemas/roles.js';
import type { MailMessage } from '../../common/mail.js';

const ROLE_WORK: Record<Role, string> = {
  admin: 'manage people, roles and invitations',
  designer: 'design measurement chains and run uncertainty studies',
  tester: 'record bench calibrations of built boards',
  lead: 'review margin studies and sign revisions off',
};

/** The role with its article, so an admin is invited "as an admin" (English article before a vowel sound). */
const withArticle = (role: Role): string => `${/^[aeiou]/.test(role) ? 'an' : 'a'} ${role}`;

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function inviteMessage(to: string, role: Role, link: string, invitedBy: string, expiresAt: Date): MailMessage {
  const expires = expiresAt.toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
  const text = [
    `${invitedBy} has invited you to Tallyvolt as ${withArticle(role)}, to ${ROLE_WORK[role]}.`,
    '',
    `Set your name and password here (the link works once, until ${expires}):`,
    link,
    '',
    'If you did not expect this, ignore this message.',
  ].join('\n');
  const html =
    `<p>${escapeHtml(invitedBy)} has invited you to Tallyvolt as ${withArticle(role).split(' ')[0]} <strong>${role}</strong>, to ${ROLE_WORK[role]}.</p>` +
    `<p><a href="${escapeHtml(link)}">Set your name and password</a> (the link works once, until ${expires}).</p>` +
    `<p>If you did not expect this, ignore this message.</p>`;
  return { to, subject: 'Your Tallyvolt invitation', text, html };
}
