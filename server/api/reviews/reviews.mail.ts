import type { MailMessage } from '../../common/mail.js';
import type { Revision } from '../../entities/Revision.js';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const title = (r: Revision) => `${r.design.name}, revision ${r.letter}`;

export function submittedMessage(to: string, revision: Revision, submittedBy: string, link: string): MailMessage {
  const text = [
    `${submittedBy} has sent ${title(revision)} for review.`,
    '',
    'Its uncertainty and margin studies are finished on the current inputs. Check the margins and approve it or ask for changes:',
    link,
  ].join('\n');
  const html = `<p>${escapeHtml(submittedBy)} has sent <strong>${escapeHtml(title(revision))}</strong> for review.</p>`
    + '<p>Its uncertainty and margin studies are finished on the current inputs.</p>'
    + `<p><a href="${escapeHtml(link)}">Check the margins and approve it or ask for changes</a>.</p>`;
  return { to, subject: `Review wanted: ${title(revision)}`, text, html };
}

export function decisionMessage(
  to: string, revision: Revision, decision: 'approve' | 'request-changes', lead: string, comment: string, link: string,
  override?: { justification: string; failing: { label: string }[] },
): MailMessage {
  const outcome = decision === 'approve' ? (override ? 'approved with an override' : 'approved') : 'sent back with changes requested';
  const against = override ? [`Approved although it fails: ${override.failing.map((f) => f.label).join('; ')}.`, `Justification: ${override.justification}`, ''] : [];
  const next = decision === 'approve'
    ? 'It is now locked; start the next revision from it for further changes.'
    : 'Move it back to draft to edit it, or start the next revision from it.';
  const text = [`${lead} has ${outcome}: ${title(revision)}.`, '', ...against, ...(comment ? [`Comment: ${comment}`, ''] : []), next, link].join('\n');
  const html = `<p>${escapeHtml(lead)} has ${outcome}: <strong>${escapeHtml(title(revision))}</strong>.</p>`
    + (override ? `<p>Approved although it fails:</p><ul>${override.failing.map((f) => `<li>${escapeHtml(f.label)}</li>`).join('')}</ul><p>Justification: ${escapeHtml(override.justification)}</p>` : '')
    + (comment ? `<blockquote>${escapeHtml(comment)}</blockquote>` : '')
    + `<p>${next} <a href="${escapeHtml(link)}">Open the revision</a>.</p>`;
  const subject = decision === 'approve' ? `Approved: ${title(revision)}` : `Changes requested: ${title(revision)}`;
  return { to, subject, text, html };
}
