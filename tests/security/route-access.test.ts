import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '../../shared/schemas/roles.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';

type Agent = ReturnType<TestApp['agent']>;
const IDENTITIES = ['anonymous', ...ROLES] as const;

/** What the role guard must answer: 401 for nobody signed in, 403 for a role the route does not admit. */
function expected(access: unknown, who: (typeof IDENTITIES)[number]): 'allowed' | 401 | 403 {
  if (access === 'public') return 'allowed';
  if (who === 'anonymous') return 401;
  if (access === 'signed-in') return 'allowed';
  return (access as string[]).includes(who) ? 'allowed' : 403;
}

// This checks the guard enforces each route's own rule; whether those rules are right is checked against a
// hand-written table in who-may-do-what.test.ts.
describe('access matrix generated from the route table', () => {
  let t: TestApp;
  const agents = new Map<string, Agent>();
  beforeAll(async () => {
    t = await createTestApp({ rateLimits: false }, 'full');
    agents.set('anonymous', t.agent());
    for (const u of DEMO_USERS) agents.set(u.role, await t.signIn(u.email, u.password));
  });
  afterAll(async () => { await t.close(); });

  it('states an access rule for every route', () => {
    expect(t.routeTable.length).toBeGreaterThan(30);
    for (const row of t.routeTable) expect(row.access === 'public' || row.access === 'signed-in' || row.access.length > 0).toBe(true);
  });

  it('answers every route × identity as its rule says, and never with a 5xx', async () => {
    const mismatches: string[] = [];
    for (const row of t.routeTable) {
      // Sign-out would end the shared sessions; it is public and covered elsewhere.
      if (row.path === '/api/auth/sign-out') continue;
      const url = row.path.replace(/:([A-Za-z]+)/g, (_m, name) => (name === 'token' ? 'x'.repeat(43) : name === 'name' ? 'E24' : '999999'));
      for (const who of IDENTITIES) {
        const agent = agents.get(who)!;
        const method = row.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        const res = await agent[method](url).send({});
        const want = expected(row.access, who);
        const roleRefusal = res.status === 403 && /needs the .* role|sign in first/.test(res.body?.error ?? '');
        const ok = want === 'allowed' ? res.status !== 401 && !roleRefusal && res.status < 500 : res.status === want;
        if (!ok) mismatches.push(`${row.method} ${row.path} as ${who}: got ${res.status} ${JSON.stringify(res.body)}, wanted ${want}`);
      }
    }
    expect(mismatches).toEqual([]);
  });
});
