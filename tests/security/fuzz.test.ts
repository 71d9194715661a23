import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteTableRow } from '../../server/common/routes.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';

type Agent = ReturnType<TestApp['agent']>;

/** 10⁴ generated inputs in all, shared out over the routes that take a body, a query or a file. */
const TOTAL_INPUTS = 10_000;
/** Routes whose valid inputs would sign the shared sessions out or start long work. */
const SKIPPED = new Set(['POST /api/auth/sign-out']);

/** Values that break naive parsers: wrong types, huge and odd numbers, numbers as strings, unicode, long text, deep nesting. */
const nasty = fc.oneof(
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e309', '-0', '0x10', '', ' ', '\u0000', '𝔘𝔫𝔦𝔠𝔬𝔡𝔢', '4K7K', '../../etc/passwd', "'; DROP TABLE users; --"),
  fc.constantFrom(1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, -1, 0, 2 ** 31, 1e-320),
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.string({ minLength: 3000, maxLength: 6000 }),
  fc.letrec((tie) => ({ deep: fc.oneof({ depthSize: 'large', maxDepth: 40 }, fc.constant(null), fc.array(tie('deep'), { maxLength: 1 }), fc.dictionary(fc.string({ maxLength: 3 }), tie('deep'), { maxKeys: 1 })) })).deep,
  fc.anything({ maxDepth: 3 }),
);
const malformedBody = fc.oneof(
  fc.dictionary(fc.constantFrom('email', 'password', 'role', 'name', 'ohms', 'tolerancePct', 'channels', 'points', 'trials', 'seed', 'serialNumber', 'revisionId', 'excluded', 'reason', 'comment', 'token', 'displayName', 'active', 'fit', 'reference', '__proto__', 'constructor'), nasty, { maxKeys: 6 }),
  fc.array(nasty, { maxLength: 3 }),
  nasty,
);
const malformedQuery = fc.dictionary(fc.constantFrom('page', 'pageSize', 'sort', 'order', 'search', 'revisionId', 'channelKey', 'mode', 'x'), fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom('NaN', '-1', '1e9', '0', '%00', '1.5')), { maxKeys: 4 });
const malformedCsv = fc.oneof(
  fc.string({ maxLength: 400 }),
  fc.uint8Array({ maxLength: 400 }).map((b) => Buffer.from(b).toString('latin1')),
  fc.array(fc.array(fc.oneof(fc.string({ maxLength: 8 }), fc.constantFrom('1M', '4K7', 'abc', '-1', '', '1,5')), { maxLength: 5 }), { maxLength: 12 })
    .map((rows) => ['value,tolerance_pct,quantity', ...rows.map((r) => r.join(','))].join('\n')),
);

describe('malformed input everywhere', () => {
  let t: TestApp;
  let agent: Agent;
  const counts = async () => {
    const out: Record<string, number> = {};
    for (const meta of t.dataSource.entityMetadatas) {
      if (meta.tableName === 'sessions') continue;
      out[meta.tableName] = Number((await t.dataSource.query(`SELECT COUNT(*) AS n FROM "${meta.tableName}"`))[0].n);
    }
    return out;
  };
  beforeAll(async () => {
    t = await createTestApp({ rateLimits: false }, 'full');
    // Admin may call most routes; the rest are checked as the role they admit.
    agent = await t.signIn('admin@example.test', 'tallyvolt-admin');
  });
  afterAll(async () => { await t.close(); });

  async function agentFor(row: RouteTableRow): Promise<Agent> {
    if (row.access === 'public' || row.access === 'signed-in' || row.access.includes('admin')) return agent;
    const user = DEMO_USERS.find((u) => (row.access as readonly string[]).includes(u.role))!;
    return t.signIn(user.email, user.password);
  }

  it('answers 10⁴ generated malformed inputs with a 4xx and a message, never a 5xx, and writes nothing', async () => {
    const targets = t.routeTable.filter((r) => !SKIPPED.has(`${r.method} ${r.path}`) && (r.body || r.query || r.upload));
    const perRoute = Math.ceil(TOTAL_INPUTS / targets.length);
    let sent = 0;
    const failures: string[] = [];
    for (const row of targets) {
      const who = await agentFor(row);
      // Existing ids for the demo data where a route needs one; the input is what is malformed.
      const url = row.path.replace(/:([A-Za-z]+)/g, (_m, name) => (name === 'token' ? 'x'.repeat(43) : name === 'name' ? 'E24' : '1'));
      const method = row.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
      const arbitrary = row.upload
        ? fc.tuple(malformedCsv, malformedQuery).map(([csv, query]) => ({ csv, query, body: undefined }))
        : row.body
          ? fc.tuple(malformedBody, fc.constant({})).map(([body, query]) => ({ body, query, csv: undefined }))
          : malformedQuery.map((query) => ({ query, body: undefined, csv: undefined }));
      await fc.assert(
        fc.asyncProperty(arbitrary, async (input) => {
          const bodyValid = row.body ? row.body.safeParse(JSON.parse(JSON.stringify(input.body ?? null) ?? 'null')).success : true;
          const queryValid = row.query ? row.query.safeParse(input.query).success : Object.keys(input.query).length === 0;
          const before = await counts();
          let req = who[method](url).query(input.query as Record<string, string>);
          req = input.csv !== undefined
            ? req.attach('file', Buffer.from(input.csv, 'latin1'), 'fuzz.csv')
            : req.set('content-type', 'application/json').send(JSON.stringify(input.body ?? null) ?? 'null');
          const res = await req;
          sent++;
          if (res.status >= 500) failures.push(`${row.method} ${row.path} → ${res.status} for ${JSON.stringify(input).slice(0, 200)}`);
          if (res.status >= 400) {
            expect(typeof res.body.error, `${row.method} ${row.path} gives a message`).toBe('string');
            expect(await counts()).toEqual(before);
          } else if (!input.csv) {
            // A 2xx is only right for an input its schema accepts.
            expect(bodyValid && (queryValid || row.method === 'GET'), `${row.method} ${row.path} accepted ${JSON.stringify(input).slice(0, 200)}`).toBe(true);
          }
        }),
        { numRuns: perRoute, seed: 20261202, endOnFailure: true },
      );
    }
    expect(failures).toEqual([]);
    expect(sent).toBeGreaterThanOrEqual(TOTAL_INPUTS);
  }, 600_000);
});
