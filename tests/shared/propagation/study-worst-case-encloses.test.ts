import { describe, expect, it } from 'vitest';
import { channelStudy } from '../../../shared/propagation/index.js';
import { demoChannel, demoChannelInput } from '../../fixtures/demo-channel.js';

describe('a study never shows a worst case narrower than its own trials', () => {
  it('widens the corner bounds to every trial when a normal tolerance is drawn beyond ±k·σ', () => {
    // A normal tolerance stated at k = 1 is drawn past its bound in about a third of trials
    // (JCGM 100:2008 4.3.4: a normal input has no finite bound), so corners alone cannot enclose them.
    const divider = demoChannelInput.divider as NonNullable<typeof demoChannelInput.divider>;
    const channel = demoChannel({
      divider: { ...divider, bottom: { ...divider.bottom, tolerancePct: 1, toleranceDistribution: 'normal', toleranceCoverageFactor: 1 } },
    });
    const study = channelStudy(channel, { seed: 11, trials: 20_000, gridPoints: 5 });
    let widened = 0;
    for (const point of study.points) {
      // a worst case bounds every trial (definition of an extreme over what was simulated)
      expect(point.worstCase.minimum).toBeLessThanOrEqual(point.monteCarlo.minimum);
      expect(point.worstCase.maximum).toBeGreaterThanOrEqual(point.monteCarlo.maximum);
      expect(point.worstCase.maxAbs).toBe(Math.max(Math.abs(point.worstCase.minimum), Math.abs(point.worstCase.maximum)));
      if (point.worstCase.widenedToTrials) widened++;
    }
    expect(widened).toBeGreaterThan(0);
  });

  it('leaves the corner bounds alone when every trial lies within them', () => {
    // rectangular bounds only: every trial is a point of the box, so the corners enclose it (definition)
    const study = channelStudy(demoChannel(), { seed: 5, trials: 20_000, gridPoints: 5 });
    for (const point of study.points) {
      expect(point.worstCase.widenedToTrials).toBeUndefined();
      expect(point.worstCase.minimum).toBeLessThanOrEqual(point.monteCarlo.minimum);
      expect(point.worstCase.maximum).toBeGreaterThanOrEqual(point.monteCarlo.maximum);
    }
  });
});
