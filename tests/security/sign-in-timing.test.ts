import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { BCRYPT_COST, checkPassword, dummyHash, hashPassword } from '../../server/common/passwords.js';
import { User } from '../../server/entities/User.js';

/** Runs one sign-in and returns the bcrypt cost of every comparison it made. */
async function comparisonCosts(t: TestApp, email: string, password: string): Promise<{ status: number; costs: number[] }> {
  const compare = vi.spyOn(bcrypt, 'compare');
  try {
    const res = await t.agent().post('/api/auth/sign-in').send({ email, password });
    return { status: res.status, costs: compare.mock.calls.map(([, hash]) => bcrypt.getRounds(String(hash))) };
  } finally {
    compare.mockRestore();
  }
}

describe('sign-in does the same work whether or not the account exists', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({ rateLimits: false }); });
  afterAll(async () => { await t.close(); });

  it('makes the stand-in hash for unknown e-mails at the configured cost', async () => {
    expect(bcrypt.getRounds((await dummyHash()).replace(/^sha256\$/, ''))).toBe(BCRYPT_COST); // the configured cost, read back
  });

  it('compares exactly once at the real cost for an unknown e-mail, a wrong password and a deactivated account', async () => {
    const unknown = await comparisonCosts(t, 'nobody-here@example.test', 'a wrong password');
    const wrong = await comparisonCosts(t, 'tester@example.test', 'a wrong password');
    await t.dataSource.getRepository(User).update({ email: 'lead@example.test' }, { active: false });
    const inactive = await comparisonCosts(t, 'lead@example.test', 'tallyvolt-lead');
    await t.dataSource.getRepository(User).update({ email: 'lead@example.test' }, { active: true });
    for (const attempt of [unknown, wrong, inactive]) {
      expect(attempt.status).toBe(401);
      expect(attempt.costs).toEqual([BCRYPT_COST]); // one comparison, at the stored hashes' cost
    }
  });
});

describe('password hashes', () => {
  it('tells apart two passwords that share their first 72 bytes', async () => {
    const head = 'x'.repeat(72); // bcrypt reads at most 72 bytes of its input (bcrypt's own limit)
    const stored = await hashPassword(`${head}-first`);
    expect((await checkPassword(`${head}-first`, stored)).ok).toBe(true);
    expect((await checkPassword(`${head}-second`, stored)).ok).toBe(false);
  });

  it('replaces a hash made without the pre-hash at the next sign-in, and the password still works', async () => {
    const t = await createTestApp({ rateLimits: false });
    try {
      const users = t.dataSource.getRepository(User);
      await users.update({ email: 'tester@example.test' }, { passwordHash: await bcrypt.hash('tallyvolt-tester', BCRYPT_COST) });
      expect((await t.agent().post('/api/auth/sign-in').send({ email: 'tester@example.test', password: 'tallyvolt-tester' })).status).toBe(200);
      const upgraded = (await users.findOneByOrFail({ email: 'tester@example.test' })).passwordHash;
      expect(upgraded.startsWith('sha256$')).toBe(true);
      expect((await t.agent().post('/api/auth/sign-in').send({ email: 'tester@example.test', password: 'tallyvolt-tester' })).status).toBe(200);
    } finally {
      await t.close();
    }
  });
});
