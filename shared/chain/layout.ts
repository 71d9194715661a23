/** Board inputs per resistor: tolerance, TCR, voltage coefficient. */
export const PER_RESISTOR = 3;

/**
 * Positions of the board inputs after the resistor block (3 per resistor) in the input vector
 * of a compiled channel; reading inputs (quantisation, isolator edges) follow the board inputs.
 */
export const BOARD = {
  gainError: 0,
  offsetError: 1,
  gainTempco: 2,
  offsetDrift: 3,
  nonlinearity: 4,
  biasCurrent: 5,
  inputResistanceTolerance: 6,
  inputResistanceTempco: 7,
  clockError: 8,
  temperature: 9,
  calibrationGain: 10,
  calibrationOffset: 11,
} as const;

/** Number of board inputs after the resistor block. */
export const BOARD_TAIL = 12;

/** Reading inputs, offsets after the last board input. */
export const READING = { quantisation: 0, startEdge: 1, endEdge: 2 } as const;

/** Number of reading inputs. */
export const READING_COUNT = 3;
