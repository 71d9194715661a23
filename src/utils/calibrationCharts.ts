import { BarController, Chart, LineController } from 'chart.js';
import { caution, graphite, steel, amber } from '@/theme/palettes';
import './chartSetup';

// The calibration charts mix bars with lines (histogram with markers), so both controllers are needed.
Chart.register(BarController, LineController);

/** Calibration chart colours, from our palettes: amber marks suspects, red only what falls outside. */
export const CALIBRATION_COLOURS = {
  point: steel[600],
  fit: steel[800],
  predictionBand: 'rgba(99, 137, 178, 0.22)',
  predictionEdge: steel[300],
  excluded: graphite[500],
  suspect: amber[500],
  outside: caution[500],
  population: steel[300],
  interval: graphite[700],
  median: graphite[500],
  board: steel[900],
};
