import { describe, expect, it } from 'vitest';
import { dividerNominal, nominalReadouts } from '../../../shared/chain/index.js';
import { findDividers } from '../../../shared/finder/index.js';
import type { DividerCandidate, FinderRequest } from '../../../shared/finder/index.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { demoChannel } from '../../fixtures/demo-channel.js';
import { fixtureSeries } from '../../helpers/stored-series.js';

/** The channel after "Use candidate": the top string and bottom replaced, every other spec kept. */
function channelWith(candidate: DividerCandidate): ChannelDefinition {
  const channel = demoChannel();
  const template = channel.divider.top[0];
  channel.divider.top = candidate.topOhms.map((nominalOhm) => ({ ...template, nominalOhm }));
  channel.divider.bottom = { ...channel.divider.bottom, nominalOhm: candidate.bottomOhms };
  return channel;
}

describe('the ratio the finder reports is the ratio the editor shows', () => {
  const channel = demoChannel(); // 10 MΩ converter input, ±1 nA bias current (invented demo)
  const request: FinderRequest = {
    maxInputVolts: 462, targetRatio: 0.016, series: fixtureSeries('E192'), minTopCount: 1, maxTopCount: 4,
    inputResistanceOhms: channel.converter.inputResistanceOhm, inputBiasAmps: channel.converter.inputBiasCurrentA,
    limits: { maxVoltsPerResistor: 160, maxWattsPerResistor: 0.2 }, maxRatioErrorFraction: 0.01,
  };

  it.each([false, true])('agrees with the live readouts to the last shown digit (mixed strings %s)', (mixedTopStrings) => {
    const { candidates } = findDividers({ ...request, mixedTopStrings, maxTopCount: mixedTopStrings ? 3 : 4 });
    expect(candidates.length).toBeGreaterThan(0);
    for (const candidate of candidates) {
      const readouts = nominalReadouts(channelWith(candidate));
      expect(candidate.ratio).toBe(readouts.ratio); // the editor's readout (shared/chain/readouts.ts) on the same channel
      expect(candidate.ratio.toPrecision(4)).toBe(readouts.ratio.toPrecision(4)); // the readout shows 4 significant digits
      expect(candidate.theveninOhms).toBe(readouts.theveninOhm);
      expect(candidate.bleedAmps).toBeCloseTo(readouts.bleedCurrentA, 15);
    }
  });

  it('ranks by the loaded ratio: its best is within the tolerance once loaded, where the bare ratio’s best is not', () => {
    const bare = findDividers({ ...request, inputResistanceOhms: undefined, inputBiasAmps: undefined }).candidates[0];
    const loadedRatio = dividerNominal(channelWith(bare).divider, 10e6).ratio;
    expect(Math.abs(loadedRatio / 0.016 - 1)).toBeGreaterThan(0.01); // R_b‖R_in pulls the bare choice off target (handbook divider)
    const loaded = findDividers(request).candidates[0];
    expect(Math.abs(loaded.ratioErrorFraction)).toBeLessThan(1e-4);
    expect(loaded.ratio).toBe(dividerNominal(channelWith(loaded).divider, 10e6).ratio); // the editor's dividerNominal
  });
});

describe('the bias current beside the ratio', () => {
  const stock = [{ ohms: 990e3, quantity: 1 }, { ohms: 10e3, quantity: 1 }, { ohms: 99e3, quantity: 1 }, { ohms: 1e3, quantity: 1 }];
  const request: FinderRequest = { maxInputVolts: 100, targetRatio: 0.01, stock, minTopCount: 1, maxTopCount: 1 };

  it('is the Thevenin offset I_b·(R_top‖R_bottom) and enters the worst case at the highest input', () => {
    const { candidates } = findDividers({ ...request, inputBiasAmps: 1e-6 });
    const wide = candidates.find((c) => c.topOhms[0] === 990e3 && c.bottomOhms === 10e3);
    expect(wide?.ratioErrorFraction).toBeCloseTo(0, 15); // 10 k / (990 k + 10 k) = 0.01 exactly
    expect(wide?.theveninOhms).toBeCloseTo(9.9e3, 9); // 990 k ‖ 10 k = 9.9 kΩ, Thevenin equivalent (hand calculation)
    expect(wide?.biasOffsetVolts).toBeCloseTo(9.9e-3, 15); // 1 µA × 9.9 kΩ (hand calculation)
    expect(wide?.worstCaseErrorFraction).toBeCloseTo(9.9e-3 / (100 * 0.01), 15); // offset over the 1 V target output (hand calculation)
  });

  it('puts the lower source resistance first when both ratios are exact, and the lower power first without bias', () => {
    const withBias = findDividers({ ...request, inputBiasAmps: 1e-6 }).candidates.slice(0, 2);
    expect(withBias.map((c) => c.bottomOhms)).toEqual([1e3, 10e3]); // 99 k/1 k and 990 k/10 k are both exactly 0.01 (by construction)
    const noBias = findDividers(request).candidates.slice(0, 2);
    expect(noBias.map((c) => c.bottomOhms)).toEqual([10e3, 1e3]); // equal ratio and parts: 0.01 W before 0.1 W (Ohm's law)
  });
});

describe('a tolerance nothing in stock meets', () => {
  const stock = Object.freeze([Object.freeze({ ohms: 1e6, quantity: 3 }), Object.freeze({ ohms: 10e3, quantity: 2 })]);
  const request: FinderRequest = { maxInputVolts: 462, targetRatio: 0.0123, stock, maxTopCount: 4, mixedTopStrings: true, maxRatioErrorFraction: 0.01 };

  it('lists no candidate as meeting it and gives the closest separately, best first and all outside it', () => {
    const found = findDividers(request);
    expect(found.candidates).toEqual([]);
    expect(found.toleranceFraction).toBe(0.01);
    expect(found.closest.length).toBeGreaterThan(0);
    expect(found.closest.length).toBeLessThanOrEqual(5);
    found.closest.forEach((c) => expect(c.worstCaseErrorFraction).toBeGreaterThan(0.01));
    expect(found.closest[0].worstCaseErrorFraction).toBeCloseTo(Math.abs(10e3 / 1.01e6 / 0.0123 - 1), 12); // 1 MΩ over 10 kΩ is the nearest the shelf allows (enumerated by hand: 1–3 MΩ top, 10 k or 20 k bottom)
    for (let i = 1; i < found.closest.length; i++) expect(found.closest[i].worstCaseErrorFraction).toBeGreaterThanOrEqual(found.closest[i - 1].worstCaseErrorFraction);
  });

  it('lists the candidates within a tolerance that some meet, and no closest ones', () => {
    const found = findDividers({ ...request, maxRatioErrorFraction: 0.25 });
    expect(found.candidates.length).toBeGreaterThan(0);
    expect(found.closest).toEqual([]);
    found.candidates.forEach((c) => expect(c.worstCaseErrorFraction).toBeLessThanOrEqual(0.25));
  });
});
