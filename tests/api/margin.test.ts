import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { putChannels, putMarginInputs } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { Revision } from '../../server/entities/Revision.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

async function waitForRun(agent: Agent, id: number, timeoutMs = 60_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const { body } = await agent.get(`/api/runs/${id}`);
    if (!['queued', 'running'].includes(body.run.state)) return body.run;
    if (Date.now() > end) throw new Error(`run ${id} still ${body.run.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Demo-like margin inputs (invented): 308–462 V pack, 1.5 kΩ into 600 µF, close at 95 %, ≥ 90 % required. */
const demoInputs = {
  packMinV: 308, packMaxV: 462, closingThresholdPct: 95, requiredRatioPct: 90,
  prechargeOhm: 1.5e3, prechargeTolerancePct: 5, linkCapacitanceF: 600e-6, capacitanceTolerancePct: 10,
  updateIntervalS: 0.01, consecutiveReadings: 3, timeoutS: 5,
  readingErrors: { mode: 'uncalibrated' },
  faults: [{ kind: 'open-precharge' }, { kind: 'bypassed-precharge' }, { kind: 'leakage', resistanceOhm: 15e3 }, { kind: 'missing-capacitance', missingPct: 30 }],
};
const small = { trials: 10_000, faultTrials: 1000, readingErrorTrials: 1000, seed: 7 };

interface ChannelView { key: string; definition: Record<string, any> }

/** The template chain with every tolerance, drift and converter error set to zero and a fast timer: readings ≈ exact. */
function errorFree(definition: Record<string, any>) {
  const d = structuredClone(definition);
  const exactResistor = (r: Record<string, unknown>) => ({ ...r, tolerancePct: 0, tcrPpmPerK: 0, voltageCoefficientPpmPerV: 0, thermalResistanceKPerW: 0 });
  d.divider.top = d.divider.top.map(exactResistor);
  d.divider.bottom = exactResistor(d.divider.bottom);
  Object.assign(d.converter, { gainErrorPct: 0, offsetErrorHz: 0, gainTempcoPpmPerK: 0, offsetDriftHzPerK: 0, nonlinearityPctFs: 0, inputBiasCurrentA: 0 });
  d.isolator = { ...d.isolator, pulseWidthDistortionS: 0 };
  d.capture = { ...d.capture, clockHz: 1e9, periodsAveraged: 1000, clockTolerancePpm: 0 };
  d.environment = { minC: 25, maxC: 25, referenceC: 25 };
  return d;
}

describe('margin studies through the API', () => {
  let t: TestApp;
  let designer: Agent;
  let lead: Agent;
  beforeAll(async () => {
    t = await createTestApp();
    designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
  });
  afterAll(async () => { await t.close(); });

  async function newRevision(name: string): Promise<number> {
    const { body } = await designer.post('/api/designs').send({ name });
    return body.design.revisions[0].id;
  }

  async function runMargin(agent: Agent, revisionId: number, request = small) {
    const started = await agent.post(`/api/revisions/${revisionId}/margin-studies`).send(request);
    expect(started.status).toBe(202);
    const run = await waitForRun(agent, started.body.run.id);
    expect(run.state).toBe('done');
    return run;
  }

  it('serves defaults for a new draft, saves edited inputs and refuses bad ones naming the field', async () => {
    const id = await newRevision('Margin inputs');
    const first = await lead.get(`/api/revisions/${id}/margin-inputs`);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ stored: false, editable: true, inputs: { closingThresholdPct: 95, packChannelKey: 'pack', linkChannelKey: 'link' } });
    const saved = await putMarginInputs(designer, id, { ...demoInputs, leakagePaths: [{ label: 'bleed resistor', resistanceOhm: 1e6 }] });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ stored: true, inputs: { plausibilityMarginPct: 10, allowedProbability: 0.001, leakagePaths: [{ label: 'bleed resistor' }] } });
    const bad = await putMarginInputs(designer, id, { ...demoInputs, prechargeOhm: -5, requiredRatioPct: 97, faults: [{ kind: 'leakage' }] });
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toMatchObject({
      prechargeOhm: 'pre-charge resistance must be > 0 Ω',
      'faults.0.resistanceOhm': expect.stringMatching(/leakage resistance/),
    });
    const reversed = await putMarginInputs(designer, id, { ...demoInputs, requiredRatioPct: 97 });
    expect(reversed.body.fields.requiredRatioPct).toBe('required ratio must not exceed the closing threshold');
    const neither = await putMarginInputs(designer, id, { ...demoInputs, requiredRatioPct: undefined });
    expect(neither.body.fields.requiredRatioPct).toBe('give the required ratio or the largest voltage step');
    expect((await putMarginInputs(lead, id, demoInputs)).status).toBe(403); // leads do not edit inputs
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    expect((await tester.post(`/api/revisions/${id}/margin-studies`).send(small)).status).toBe(403);
    expect((await lead.get(`/api/revisions/${id}/margin-inputs`)).body.inputs.prechargeOhm).toBe(1500); // nothing half-written
    await t.dataSource.getRepository(Revision).update({ id }, { state: 'approved' });
    const locked = await putMarginInputs(designer, id, demoInputs);
    expect(locked.status).toBe(409);
    expect((await lead.get(`/api/revisions/${id}/margin-inputs`)).body.editable).toBe(false);
  });

  it('matches the closed forms with a leakage path and exact readings', async () => {
    const id = await newRevision('Closed forms');
    const rev = (await designer.get(`/api/revisions/${id}`)).body.revision;
    const channels = rev.channels.map((c: ChannelView) => ({ key: c.key, definition: errorFree(c.definition) }));
    expect((await putChannels(designer, id, { channels })).status).toBe(200);
    const leakOhm = 150e3;
    await putMarginInputs(designer, id, {
      ...demoInputs, packMinV: 400, packMaxV: 400, prechargeTolerancePct: 0, capacitanceTolerancePct: 0,
      leakagePaths: [{ label: 'insulation monitor', resistanceOhm: leakOhm }], faults: [], allowedProbability: 0.01,
    });
    const run = await runMargin(lead, id, { ...small, trials: 2000 });
    const r = run.result;
    const link = channels[1].definition;
    const dividerOhm = link.divider.top.reduce((s: number, x: { nominalOhm: number }) => s + x.nominalOhm, 0)
      + (link.divider.bottom.nominalOhm * link.converter.inputResistanceOhm) / (link.divider.bottom.nominalOhm + link.converter.inputResistanceOhm);
    const rl = 1 / (1 / dividerOhm + 1 / leakOhm);
    const rp = 1.5e3;
    const c = 600e-6;
    expect(r.model.leakageOhm).toBeCloseTo(rl, 6);
    expect(r.model.nominalSteadyRatio).toBeCloseTo(rl / (rp + rl), 12); // handbook RC charging: V_link(∞) = V·R_l/(R_p + R_l)
    const tau = ((rp * rl) / (rp + rl)) * c; // handbook RC charging: τ = (R_p ‖ R_l)·C
    expect(r.model.nominalTimeConstantS).toBeCloseTo(tau, 12);
    const crossS = -tau * Math.log(1 - (0.95 * (rp + rl)) / rl); // handbook RC charging
    const expectedS = (Math.ceil(crossS / 0.01) + 3 - 1) * 0.01; // first reading after the crossing, then 2 more every 10 ms
    expect(Math.abs(crossS / 0.01 - Math.round(crossS / 0.01))).toBeGreaterThan(0.05); // not on a reading boundary, so rounding is unambiguous
    for (const ch of r.model.readingErrors.channels) expect(ch.gainSigmaFraction).toBeLessThan(1e-6); // the chain reads exactly (quantisation only)
    expect(r.earlyClosureProbability).toBe(0);
    expect(r.neverReachedProbability).toBe(0);
    for (const q of r.closureTimeS.quantiles) expect(q.value).toBeCloseTo(expectedS, 9);
    expect(r.model.nominalCloseS).toBeCloseTo(expectedS, 12);
    const curve = r.charts.ratioOverTime;
    curve.timeS.forEach((ts: number, i: number) =>
      expect(curve.healthyNominal[i]).toBeCloseTo((rl / (rp + rl)) * (1 - Math.exp(-ts / tau)), 12)); // handbook RC charging
    expect(r.resolution.independentTrials).toBe(1000); // 2000 trials sharing 1000 simulated boards
    expect(r.verdict).toBe('pass'); // 0 events on 1000 samples: ≤ 3.0·10⁻³ < 10⁻², exact Clopper–Pearson
  });

  it('gives the canonical fault verdicts and shows an undetected fault as a failure', async () => {
    const id = await newRevision('Fault cases');
    await putMarginInputs(designer, id, demoInputs);
    const run = await runMargin(designer, id);
    const r = run.result;
    expect(run.current).toBe(true);
    expect(r.faults.map((f: { verdict: string }) => f.verdict)).toEqual(['too-slow', 'too-fast', 'too-slow', 'not-detected']); // common practice: open/leak slow, bypass fast
    expect(r.earlyClosureProbability).toBe(0); // 5 % between closing and required ratio against ~0.6 % reading spread
    expect(r.window.tooFastBelowS).toBeLessThan(r.closureTimeS.quantiles[0].value);
    expect(r.verdict).toBe('fail');
    const keysWith = (outcome: string) => r.summary.filter((c: { outcome: string }) => c.outcome === outcome).map((c: { key: string }) => c.key);
    expect(keysWith('not-met')).toEqual(['fault-4']);
    expect(keysWith('met')).toEqual(['closes']);
    // 1000 shared boards cannot show 10⁻³: even no events leaves 1 − 0.05^(1/1000) = 3.0·10⁻³ (exact Clopper–Pearson)
    expect(keysWith('not-shown')).toEqual(['early-closure', 'timeout', 'false-alarm', 'fault-1', 'fault-2', 'fault-3']);
    expect(r.resolution).toMatchObject({ readingErrorDraws: 1000, independentTrials: 1000, faultIndependentTrials: 1000, neededForAllowed: 2995 });
    expect(r.resolution.smallestShowable).toBeCloseTo(1 - 0.05 ** (1 / 1000), 12); // exact Clopper–Pearson after 0 of 1000
    for (const c of r.summary) {
      expect(c).toMatchObject({ criterion: expect.any(String), pass: c.outcome === 'met', unit: expect.any(String), explanation: expect.any(String) });
    }
    expect(r.summary.find((c: { key: string }) => c.key === 'early-closure').explanation).toMatch(/share 1000 simulated boards.*run more simulated boards/);
    expect(r.charts.ratioOverTime.faults).toHaveLength(4);
    expect(r.charts.ratioOverTime.faults[0].ratio.every((v: number) => v === 0)).toBe(true); // open path: the link stays at 0 V
    expect(r.charts.ratioAtClosureHistogram).toMatchObject({ requiredRatio: 0.9, thresholdRatio: 0.95 });
    expect(r.charts.ratioAtClosureHistogram.counts.reduce((a: number, b: number) => a + b, 0)).toBe(10_000);

    const list = await lead.get(`/api/revisions/${id}/margin-studies`);
    expect(list.body.items[0]).toMatchObject({ id: run.id, kind: 'margin', state: 'done', current: true });
    await putMarginInputs(designer, id, { ...demoInputs, timeoutS: 6 });
    expect((await lead.get(`/api/runs/${run.id}`)).body.run.current).toBe(false); // inputs changed after it ran
  });

  it('reports a heavy leakage as unable to close, not as a pass', async () => {
    const id = await newRevision('Heavy leakage');
    await putMarginInputs(designer, id, { ...demoInputs, leakagePaths: [{ label: 'welded discharge path', resistanceOhm: 20e3 }] });
    const r = (await runMargin(designer, id, { ...small, trials: 2000 })).result;
    expect(r.verdict).toBe('unable-to-close');
    expect(r.model.nominalSteadyRatio).toBeLessThan(0.95); // 20 kΩ ‖ 4 MΩ against 1.5 kΩ settles near 93 % (handbook RC charging)
    const closes = r.summary.find((c: { key: string }) => c.key === 'closes');
    expect(closes).toMatchObject({ pass: false, unit: '%', limit: 95 });
    expect(closes.explanation).toMatch(/^Unable to close/);
    expect(r.window).toBeNull();
    expect(r.faults.every((f: { verdict: string }) => f.verdict === 'not-evaluated')).toBe(true);
  });

  it('does not call a 10⁻⁵ criterion met on 500 simulated boards however many trials share them', async () => {
    const id = await newRevision('Few boards');
    const loaded = await designer.get(`/api/revisions/${id}/margin-inputs`);
    const saved = await designer.put(`/api/revisions/${id}/margin-inputs`)
      .send({ ...demoInputs, allowedProbability: 1e-5, faults: [], baseVersion: loaded.body.version });
    expect(saved.body).toMatchObject({ inputs: { allowedProbability: 1e-5 } });
    const r = (await runMargin(designer, id, { ...small, trials: 20_000, readingErrorTrials: 500 })).result;
    expect(r.earlyClosureProbability).toBe(0); // 5 % between closing and required ratio: no early closure in the count
    const early = r.summary.find((c: { key: string }) => c.key === 'early-closure');
    expect(early).toMatchObject({ outcome: 'not-shown', pass: false });
    expect(early.upperBound).toBeCloseTo(1 - 0.05 ** (1 / 500), 12); // exact Clopper–Pearson after 0 of 500 boards, ≈ 3/500 (rule of three)
    expect(r.resolution).toMatchObject({ readingErrorDraws: 500, independentTrials: 500, neededForAllowed: 299_572 }); // ln 0.05/ln(1 − 10⁻⁵), exact
    expect(r.verdict).toBe('not-shown');
    const bad = await designer.post(`/api/revisions/${id}/margin-studies`).send({ ...small, readingErrorTrials: 2_000_000 });
    expect(bad.status).toBe(400);
    expect(bad.body.fields.readingErrorTrials).toBe('readingErrorTrials must be ≤ 1000000');
  });

  it('checks a voltage-step limit when one is given', async () => {
    const id = await newRevision('Step limit');
    await putMarginInputs(designer, id, { ...demoInputs, requiredRatioPct: undefined, maxStepV: 10, faults: [] });
    const r = (await runMargin(designer, id, { ...small, trials: 2000 })).result;
    expect(r.earlyClosureProbability).toBeNull();
    expect(r.stepExceedanceProbability).toBeGreaterThan(0.5); // closing at 95 % of up to 462 V leaves ~23 V, above 10 V
    expect(r.summary.find((c: { key: string }) => c.key === 'step-limit').pass).toBe(false);
  });

});

describe('margin study with a built board\'s calibration', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({}, 'full'); });
  afterAll(async () => { await t.close(); });
  async function runMargin(agent: Agent, revisionId: number, request = small) {
    const started = await agent.post(`/api/revisions/${revisionId}/margin-studies`).send(request);
    expect(started.status).toBe(202);
    const run = await waitForRun(agent, started.body.run.id);
    expect(run.state).toBe('done');
    return run;
  }

  it('reads both channels with the demo board\'s own calibration, and refuses a board with none', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const board = (await tester.get('/api/boards')).body.items[0];
    // Only a board built to the revision's own design may be used: study the demo design's next draft.
    const design = (await designer.get(`/api/designs/${board.designId}`)).body.design;
    const next = await designer.post(`/api/designs/${design.id}/revisions`).send({ fromRevisionId: design.revisions.at(-1).id });
    const id = next.body.revision.id;
    await putMarginInputs(designer, id, { ...demoInputs, readingErrors: { mode: 'board', boardId: board.id }, faults: [] });
    const r = (await runMargin(designer, id, { ...small, trials: 2000 })).result;
    expect(r.model.readingErrors).toMatchObject({ mode: 'board', boardId: board.id });
    expect(r.model.readingErrors.description).toMatch(/PM-2-001.*pack 2026-11-20/);
    // A calibrated board reads far tighter than the design's uncalibrated spread.
    await putMarginInputs(designer, id, { ...demoInputs, readingErrors: { mode: 'uncalibrated' }, faults: [] });
    const uncalibrated = (await runMargin(designer, id, { ...small, trials: 2000 })).result;
    expect(r.model.readingErrors.channels[0].gainSigmaFraction).toBeLessThan(uncalibrated.model.readingErrors.channels[0].gainSigmaFraction);
    const bare = await tester.post('/api/boards').send({ serialNumber: 'BARE-1', revisionId: board.revisionId, buildDate: '2026-11-30', confirmDraft: true });
    const refused = await putMarginInputs(designer, id, { ...demoInputs, readingErrors: { mode: 'board', boardId: bare.body.board.id }, faults: [] });
    expect(refused.status).toBe(400);
    expect(refused.body.error).toBe('board BARE-1 has no completed calibration of the pack and link channels');
  });
});
