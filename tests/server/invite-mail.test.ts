import { describe, expect, it } from 'vitest';
import { inviteMessage } from '../../server/api/invites/invites.mail.js';

describe('invitation e-mail wording', () => {
  const expires = new Date('2026-12-06T12:00:00Z');
  it('invites "as an admin" and "as a designer" (English indefinite article before a vowel sound, common practice)', () => {
    const admin = inviteMessage('new@example.test', 'admin', 'http://127.0.0.1:3000/invite/x', 'Demo Admin', expires);
    expect(admin.text).toContain('as an admin,');
    expect(admin.html).toContain('as an <strong>admin</strong>');
    const designer = inviteMessage('new@example.test', 'designer', 'http://127.0.0.1:3000/invite/x', 'Demo Admin', expires);
    expect(designer.text).toContain('as a designer,');
    expect(designer.html).toContain('as a <strong>designer</strong>');
  });
});
