import type { MarginInputs } from '../../../shared/schemas/margin.js';

/**
 * What a revision's margin study starts from until someone saves its own inputs: a plausible
 * pre-charge for a few-hundred-volt pack, meant to be edited.
 */
export const DEFAULT_MARGIN_INPUTS: MarginInputs = {
  packMinV: 308,
  packMaxV: 462,
  closingThresholdPct: 95,
  requiredRatioPct: 90,
  prechargeOhm: 1.5e3,
  prechargeTolerancePct: 5,
  linkCapacitanceF: 600e-6,
  capacitanceTolerancePct: 10,
  leakagePaths: [],
  packChannelKey: 'pack',
  linkChannelKey: 'link',
  updateIntervalS: 0.01,
  consecutiveReadings: 3,
  timeoutS: 5,
  readingErrors: { mode: 'uncalibrated' },
  faults: [
    { kind: 'open-precharge' },
    { kind: 'bypassed-precharge', residualOhm: 0 },
    { kind: 'leakage', resistanceOhm: 15e3 },
    { kind: 'missing-capacitance', missingPct: 30 },
  ],
  plausibilityMarginPct: 10,
  allowedProbability: 0.001,
};
