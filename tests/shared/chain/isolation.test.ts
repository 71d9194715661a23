import { describe, expect, it } from 'vitest';
import { isolationWarnings, nominalReadouts } from '../../../shared/chain/index.js';
import { channelSchema } from '../../../shared/schemas/chain.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel, demoChannelInput } from '../../fixtures/demo-channel.js';

// The demo channel's range maximum is 462 V (tests/fixtures/demo-channel.ts).
const withIsolator = (isolator: Record<string, unknown>) => deepFreeze(demoChannel({ isolator: { maxSignalRateBd: 1e6, pulseWidthDistortionS: 3e-9, ...isolator } }));
const codes = (warnings: { code: string }[]) => warnings.map((w) => w.code);

describe('isolation rating against the range maximum', () => {
  it('passes a rating at exactly the range maximum with no margin', () => {
    expect(isolationWarnings(withIsolator({ ratedWorkingVoltageV: 462 }), 0)).toEqual([]); // 462 ≤ 462, in this test
  });

  it('warns when the range maximum with the margin exceeds the rated working voltage', () => {
    // 462 V × 1.10 = 508.2 V > 500 V, hand arithmetic in this test
    const warnings = isolationWarnings(withIsolator({ ratedWorkingVoltageV: 500 }), 10);
    expect(codes(warnings)).toEqual(['isolation-rating-exceeded']);
    expect(warnings[0].message).toContain('508.2 V');
    expect(warnings[0].where).toBe('isolator.ratedWorkingVoltageV');
    expect(isolationWarnings(withIsolator({ ratedWorkingVoltageV: 509 }), 10)).toEqual([]); // 508.2 V ≤ 509 V, in this test
  });

  it('checks the rated insulation test voltage against the margin and against the required test voltage', () => {
    // 462 V × 1.5 = 693 V > 600 V test rating; 600 V < 2500 V required, hand arithmetic in this test
    const warnings = isolationWarnings(withIsolator({ ratedWorkingVoltageV: 1000, ratedTestVoltageV: 600, requiredTestVoltageV: 2500, isolationRule: 'team rule 4.2' }), 50);
    expect(codes(warnings)).toEqual(['isolation-rating-exceeded', 'isolation-rating-exceeded']);
    expect(warnings[1].message).toContain('(team rule 4.2)');
  });

  it('warns when a layout distance falls short of the required one and passes an equal one', () => {
    const warnings = isolationWarnings(withIsolator({ ratedWorkingVoltageV: 1000, creepageMm: 3.9, requiredCreepageMm: 4, clearanceMm: 3, requiredClearanceMm: 3, isolationRule: 'our layout rules' }));
    expect(codes(warnings)).toEqual(['isolation-distance-short']); // 3.9 mm < 4 mm; 3 mm = 3 mm passes, in this test
    expect(warnings[0].where).toBe('isolator.creepageMm');
  });

  it('says what it could not check: no rating, a required distance without the layout one, required values without a rule', () => {
    const warnings = isolationWarnings(withIsolator({ requiredClearanceMm: 5 }));
    expect(warnings.map((w) => [w.code, w.level, w.where])).toEqual([
      ['isolation-not-checked', 'info', 'isolator.ratedWorkingVoltageV'],
      ['isolation-not-checked', 'info', 'isolator.clearanceMm'],
      ['isolation-not-checked', 'info', 'isolator.isolationRule'],
    ]);
  });

  it('gives nothing for a channel without an isolator and refuses a negative margin', () => {
    const { isolator: _none, ...rest } = demoChannelInput;
    expect(isolationWarnings(channelSchema.parse(rest), 20)).toEqual([]);
    expect(() => isolationWarnings(withIsolator({}), -1)).toThrow('isolation margin must be ≥ 0 %');
    expect(() => isolationWarnings(withIsolator({}), Number.NaN)).toThrow('isolation margin');
  });

  it('is part of the editor warnings at no margin', () => {
    // 462 V > 400 V, in this test
    expect(codes(nominalReadouts(withIsolator({ ratedWorkingVoltageV: 400 })).warnings)).toContain('isolation-rating-exceeded');
  });

  it('refuses a distance that is not positive, naming the field', () => {
    const parsed = channelSchema.safeParse({ ...demoChannelInput, isolator: { maxSignalRateBd: 1e6, creepageMm: 0 } });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].message).toBe('creepage must be > 0 mm');
  });
});
