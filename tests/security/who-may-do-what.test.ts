import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';

/**
 * Who may do what, written out by hand in the words a lead would sign: one row per action. It deliberately
 * does not read the route table's access lists or the shared role groups, so a wrong role list in the code
 * fails here instead of being copied into the expectation.
 */
type Person = 'admin' | 'designer' | 'tester' | 'lead';
type Who = 'anyone' | 'anyone signed in' | readonly Person[];
interface Row { action: string; route: string; who: Who }

const DESIGNERS_AND_ADMINS = ['designer', 'admin'] as const;
const TESTERS_AND_ADMINS = ['tester', 'admin'] as const;
const LEADS_AND_ADMINS = ['lead', 'admin'] as const;
const EVERY_ROLE = ['admin', 'designer', 'tester', 'lead'] as const;
const ADMINS = ['admin'] as const;

const WHO_MAY_DO_WHAT: Row[] = [
  // Signing in and out, and what needs no account
  { action: 'anyone may try to sign in', route: 'POST /api/auth/sign-in', who: 'anyone' },
  { action: 'anyone may sign out', route: 'POST /api/auth/sign-out', who: 'anyone' },
  { action: 'a signed-in person may ask who they are', route: 'GET /api/auth/me', who: 'anyone signed in' },
  { action: 'anyone may ask whether they are signed in (the answer is no user when not)', route: 'GET /api/auth/session', who: 'anyone' },
  { action: 'anyone may ask for a password-reset mail', route: 'POST /api/auth/password-reset', who: 'anyone' },
  { action: 'anyone holding a reset link may check it', route: 'GET /api/auth/password-reset/:token', who: 'anyone' },
  { action: 'anyone holding a reset link may set a new password', route: 'POST /api/auth/password-reset/complete', who: 'anyone' },
  { action: 'anyone holding an invitation may read it', route: 'GET /api/invites/:token', who: 'anyone' },
  { action: 'anyone holding an invitation may accept it', route: 'POST /api/invites/accept', who: 'anyone' },

  // People and mail
  { action: 'only an admin lists the people', route: 'GET /api/users', who: ADMINS },
  { action: 'only an admin changes a person’s role or deactivates them', route: 'PATCH /api/users/:id', who: ADMINS },
  { action: 'only an admin invites someone', route: 'POST /api/invites', who: ADMINS },
  { action: 'only an admin lists the open invitations', route: 'GET /api/invites', who: ADMINS },
  { action: 'only an admin sends an invitation again', route: 'POST /api/invites/:id/resend', who: ADMINS },
  { action: 'only an admin withdraws an invitation', route: 'DELETE /api/invites/:id', who: ADMINS },
  { action: 'only an admin reads the mail outbox', route: 'GET /api/outbox', who: ADMINS },

  // Preferred-value series
  { action: 'everyone signed in reads the stored series', route: 'GET /api/series', who: 'anyone signed in' },
  { action: 'everyone signed in reads one stored series', route: 'GET /api/series/:name', who: 'anyone signed in' },
  { action: 'a designer (or admin) adds the team’s own series', route: 'POST /api/series', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) imports a series from CSV', route: 'POST /api/series/import', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) changes the team’s own series', route: 'PUT /api/series/:name', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) deletes the team’s own series', route: 'DELETE /api/series/:name', who: DESIGNERS_AND_ADMINS },

  // Stock
  { action: 'every role reads the stock', route: 'GET /api/stock', who: EVERY_ROLE },
  { action: 'every role downloads the stock as CSV', route: 'GET /api/stock/export.csv', who: EVERY_ROLE },
  { action: 'a designer (or admin) adds a stock part', route: 'POST /api/stock', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) changes a stock part', route: 'PATCH /api/stock/:id', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) deletes a stock part', route: 'DELETE /api/stock/:id', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) imports stock from CSV', route: 'POST /api/stock/import', who: DESIGNERS_AND_ADMINS },

  // Designs and revisions
  { action: 'every role reads the list of designs', route: 'GET /api/designs', who: EVERY_ROLE },
  { action: 'every role reads a design', route: 'GET /api/designs/:id', who: EVERY_ROLE },
  { action: 'a designer (or admin) creates a design', route: 'POST /api/designs', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) renames or describes a design', route: 'PATCH /api/designs/:id', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer (or admin) starts the next revision', route: 'POST /api/designs/:id/revisions', who: DESIGNERS_AND_ADMINS },
  { action: 'every role reads a revision', route: 'GET /api/revisions/:id', who: EVERY_ROLE },
  { action: 'a designer (or admin) edits a draft revision’s channels', route: 'PUT /api/revisions/:id/channels', who: DESIGNERS_AND_ADMINS },
  { action: 'every role reads a revision’s history', route: 'GET /api/revisions/:id/history', who: EVERY_ROLE },

  // Studies
  { action: 'a designer (or admin) starts an uncertainty study', route: 'POST /api/revisions/:id/studies', who: DESIGNERS_AND_ADMINS },
  { action: 'every role reads a revision’s uncertainty studies', route: 'GET /api/revisions/:id/studies', who: EVERY_ROLE },
  { action: 'every role reads a study run', route: 'GET /api/runs/:id', who: EVERY_ROLE },
  { action: 'whoever may start a margin study may cancel a run (the service then requires its starter or an admin)', route: 'POST /api/runs/:id/cancel', who: ['designer', 'lead', 'admin'] },
  { action: 'every role reads the margin inputs', route: 'GET /api/revisions/:id/margin-inputs', who: EVERY_ROLE },
  { action: 'a designer (or admin) saves the margin inputs', route: 'PUT /api/revisions/:id/margin-inputs', who: DESIGNERS_AND_ADMINS },
  { action: 'a designer, a lead or an admin starts a margin study', route: 'POST /api/revisions/:id/margin-studies', who: ['designer', 'lead', 'admin'] },
  { action: 'every role reads a revision’s margin studies', route: 'GET /api/revisions/:id/margin-studies', who: EVERY_ROLE },

  // Review and sign-off
  { action: 'a designer (or admin) submits a revision for review', route: 'POST /api/revisions/:id/submit', who: DESIGNERS_AND_ADMINS },
  { action: 'a lead (or admin) approves a revision', route: 'POST /api/revisions/:id/approve', who: LEADS_AND_ADMINS },
  { action: 'a lead (or admin) requests changes', route: 'POST /api/revisions/:id/request-changes', who: LEADS_AND_ADMINS },
  { action: 'a lead (or admin) checks what an approval would override', route: 'GET /api/revisions/:id/approval-check', who: LEADS_AND_ADMINS },
  { action: 'a designer (or admin) reopens a revision sent back', route: 'POST /api/revisions/:id/reopen', who: DESIGNERS_AND_ADMINS },
  { action: 'every role reads the list of reviews', route: 'GET /api/reviews', who: EVERY_ROLE },
  { action: 'a signed-in person reads a revision’s report', route: 'GET /api/revisions/:id/report', who: 'anyone signed in' },
  { action: 'a signed-in person downloads a revision’s report as PDF', route: 'GET /api/revisions/:id/report.pdf', who: 'anyone signed in' },

  // Boards and calibration
  { action: 'every role reads the boards', route: 'GET /api/boards', who: EVERY_ROLE },
  { action: 'every role reads a board', route: 'GET /api/boards/:id', who: EVERY_ROLE },
  { action: 'a tester (or admin) registers a board', route: 'POST /api/boards', who: TESTERS_AND_ADMINS },
  { action: 'a tester (or admin) opens a calibration session on a board', route: 'POST /api/boards/:id/sessions', who: TESTERS_AND_ADMINS },
  { action: 'every role reads the calibration overview', route: 'GET /api/calibrations/overview', who: EVERY_ROLE },
  { action: 'every role reads a calibration session', route: 'GET /api/calibrations/:id', who: EVERY_ROLE },
  { action: 'a tester (or admin) edits a session’s details', route: 'PATCH /api/calibrations/:id', who: TESTERS_AND_ADMINS },
  { action: 'a tester (or admin) records calibration points', route: 'PUT /api/calibrations/:id/points', who: TESTERS_AND_ADMINS },
  { action: 'a tester (or admin) imports calibration points from CSV', route: 'POST /api/calibrations/:id/points/import', who: TESTERS_AND_ADMINS },
  { action: 'a tester (or admin) excludes a point with a reason', route: 'PATCH /api/calibrations/:id/points/:pointId', who: TESTERS_AND_ADMINS },
  { action: 'a tester (or admin) completes a session', route: 'POST /api/calibrations/:id/complete', who: TESTERS_AND_ADMINS },
  { action: 'a tester (or admin) reopens a completed session', route: 'POST /api/calibrations/:id/reopen', who: TESTERS_AND_ADMINS },
  { action: 'every role downloads the firmware coefficients as a C header', route: 'GET /api/calibrations/:id/export.h', who: EVERY_ROLE },
  { action: 'every role downloads the firmware coefficients as JSON', route: 'GET /api/calibrations/:id/export.json', who: EVERY_ROLE },
];

const IDENTITIES = ['anonymous', 'admin', 'designer', 'tester', 'lead'] as const;
type Identity = (typeof IDENTITIES)[number];
type Agent = ReturnType<TestApp['agent']>;

function mayCall(who: Who, identity: Identity): boolean {
  if (who === 'anyone') return true;
  if (identity === 'anonymous') return false;
  return who === 'anyone signed in' || (who as readonly string[]).includes(identity);
}

/** The guard's refusals are 401 (nobody signed in) and a 403 that names the role; anything else got past it. */
const refusedByGuard = (status: number, error: unknown) =>
  status === 401 || (status === 403 && /needs the .* role/.test(String(error ?? '')));

const urlOf = (path: string) =>
  path.replace(/:([A-Za-z]+)/g, (_m, name: string) => (name === 'token' ? 'x'.repeat(43) : name === 'name' ? 'E24' : '999999'));

describe('who may do what, as a lead would write it, against the running app', () => {
  let t: TestApp;
  const agents = new Map<Identity, Agent>();
  beforeAll(async () => {
    t = await createTestApp({ rateLimits: false }, 'full');
    agents.set('anonymous', t.agent());
    for (const u of DEMO_USERS) agents.set(u.role as Identity, await t.signIn(u.email, u.password));
  });
  afterAll(async () => { await t.close(); });

  it('has a row for every route the app serves, so a new route cannot slip in unwritten', () => {
    const served = t.routeTable.map((r) => `${r.method} ${r.path}`);
    const written = WHO_MAY_DO_WHAT.map((r) => r.route);
    expect(served.filter((route) => !written.includes(route))).toEqual([]);
    expect(written.filter((route) => !served.includes(route))).toEqual([]);
    expect(new Set(written).size).toBe(written.length);
  });

  it('lets exactly the people in each row past the door, and nobody else', async () => {
    const wrong: string[] = [];
    for (const row of WHO_MAY_DO_WHAT) {
      const [method, path] = row.route.split(' ') as [string, string];
      for (const identity of IDENTITIES) {
        // Signing out would end the shared session, so that row uses a session of its own.
        const person = DEMO_USERS.find((u) => u.role === identity);
        const agent = path === '/api/auth/sign-out' && person ? await t.signIn(person.email, person.password) : agents.get(identity)!;
        const res = await agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](urlOf(path)).send({});
        const refused = refusedByGuard(res.status, res.body?.error);
        if (res.status >= 500) wrong.push(`${row.route} as ${identity}: ${res.status}`);
        else if (refused === mayCall(row.who, identity)) {
          wrong.push(`${row.action} (${row.route}) as ${identity}: ${refused ? 'refused' : 'let through'} with ${res.status}`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });
});
