import { describe, expect, it } from 'vitest';
import { diffRevisions, studyHeadlines, type RevisionSide } from '../../shared/compare/index.js';
import { marginInputsSchema } from '../../shared/schemas/margin.js';
import { deepFreeze } from '../fixtures/deep-freeze.js';
import { demoChannel, demoChannelInput } from '../fixtures/demo-channel.js';

// Invented margin inputs for the demo pack (308–462 V, 1.5 kΩ into 600 µF).
const margin = marginInputsSchema.parse({
  packMinV: 308, packMaxV: 462, closingThresholdPct: 95, requiredRatioPct: 90, prechargeOhm: 1500, prechargeTolerancePct: 5,
  linkCapacitanceF: 600e-6, capacitanceTolerancePct: 10, updateIntervalS: 0.01, consecutiveReadings: 3, timeoutS: 5,
});
const side = (overrides: Partial<RevisionSide> = {}): RevisionSide => deepFreeze({
  channels: [{ key: 'pack', definition: demoChannel() }],
  marginInputs: margin,
  studies: { uncertainty: null, margin: null },
  ...overrides,
});
const changed = (before: RevisionSide, after: RevisionSide) => diffRevisions(before, after).filter((r) => r.changed).map((r) => `${r.section} | ${r.label}: ${r.before} → ${r.after}`);

describe('revision comparison, value by value', () => {
  it('marks nothing changed between a revision and a copy of it, yet lists every value', () => {
    const rows = diffRevisions(side(), side());
    expect(rows.some((r) => r.changed)).toBe(false);
    expect(rows.find((r) => r.label === 'Top resistor 1 resistance')).toEqual({ section: 'pack side (demo) · Divider', label: 'Top resistor 1 resistance', before: '1 MΩ', after: '1 MΩ', changed: false });
    expect(rows.find((r) => r.label === 'Pack maximum')?.after).toBe('462 V'); // the inputs above
  });

  it('gives old → new with units in the forms’ words for a changed channel input and margin input', () => {
    const bottom = { ...demoChannelInput.divider.bottom, nominalOhm: 4.87e3 };
    const after = side({
      channels: [{ key: 'pack', definition: demoChannel({ divider: { ...demoChannelInput.divider, bottom } }) }],
      marginInputs: { ...margin, closingThresholdPct: 93, isolationMarginPct: 20 },
    });
    expect(changed(side(), after)).toEqual([
      'pack side (demo) · Divider | Bottom resistor resistance: 4.99 kΩ → 4.87 kΩ', // the fixture's 4.99 kΩ, in this test
      'Margin inputs | Closing threshold: 95 % → 93 %',
      'Margin inputs | Isolation margin: null → 20 %',
    ]);
  });

  it('lines up top strings of different lengths and a channel only one side has', () => {
    const longer = { ...demoChannelInput.divider, top: [...demoChannelInput.divider.top, demoChannelInput.divider.top[0]] };
    const after = side({ channels: [{ key: 'pack', definition: demoChannel({ divider: longer }) }, { key: 'aux', definition: demoChannel({ name: 'aux bus' }) }] });
    const rows = diffRevisions(side(), after);
    expect(rows.find((r) => r.label === 'Top resistors')).toMatchObject({ before: '4', after: '5', changed: true }); // 4 → 5 resistors, in this test
    expect(rows.find((r) => r.label === 'Top resistor 5 resistance')).toMatchObject({ before: null, after: '1 MΩ', changed: true });
    expect(rows.find((r) => r.section === 'aux bus' && r.label === 'Channel name')).toMatchObject({ before: null, after: 'aux bus', changed: true });
  });

  it('marks an input change below four digits, which six printed digits still show', () => {
    const after = side({ channels: [{ key: 'pack', definition: demoChannel({ rangeV: { minV: 0, maxV: 462.01 } }) }] });
    expect(changed(side(), after)).toEqual(['pack side (demo) · Range | Maximum voltage: 462 V → 462.01 V']); // in this test
  });

  it('compares study headlines as printed: worst case, widest Monte Carlo interval and the margin verdicts', () => {
    const points = (worst: number, half: number) => [
      { voltageV: 0, monteCarloIntervalV: { low: -0.1, high: 0.1 }, worstCaseMaxAbsV: 0.2 },
      { voltageV: 462, monteCarloIntervalV: { low: -half, high: half }, worstCaseMaxAbsV: worst },
    ];
    const study = (worst: number, half: number, pass: boolean) => studyHeadlines(
      [{ key: 'pack', name: 'pack side (demo)', coverageProbability: 0.95, points: points(worst, half) }],
      { verdict: pass ? 'pass' : 'fail', summary: [{ key: 'early', criterion: 'Early closure', pass, outcome: pass ? 'met' : 'failed' }], faults: [{ key: 'f1', label: 'Open pre-charge path', verdict: 'too-slow' }] },
    );
    // 1.2341 and 1.2344 V both print 1.23 V at three digits: a rerun's noise is not a change (in this test)
    expect(changed(side({ studies: study(1.2341, 0.5, true) }), side({ studies: study(1.2344, 0.5, true) }))).toEqual([]);
    expect(changed(side({ studies: study(1.23, 0.5, true) }), side({ studies: study(2.5, 0.75, false) }))).toEqual([
      'Uncertainty study | pack side (demo): largest worst-case error: ±1.23 V → ±2.5 V',
      'Uncertainty study | pack side (demo): widest Monte Carlo interval: -500 mV to 500 mV at 462 V (p = 0.95) → -750 mV to 750 mV at 462 V (p = 0.95)',
      'Margin study | Margin verdict: pass → fail',
      'Margin study | Early closure: met → failed',
    ]);
  });

  it('says a margin study only one side has is missing on the other, without listing its criteria', () => {
    const after = side({ studies: studyHeadlines(null, { verdict: 'pass', summary: [], faults: [] }) });
    expect(changed(side(), after)).toEqual(['Margin study | Margin verdict: no finished study → pass']); // in this test
    expect(diffRevisions(side(), side()).find((r) => r.label === 'Margin verdict')).toMatchObject({ before: 'no finished study', changed: false });
  });
});
