import { BarController, Chart, LineController } from 'chart.js';
import type { Histogram } from '@shared/propagation/histogram';
import '@/utils/chartSetup';

// Histograms mix bars with marker lines, so both controllers must be known whichever component loads first.
Chart.register(BarController, LineController);

/** Margin chart colours, from our palettes: steel for the healthy spread, graphite for limits, amber for the window. */
export const MARGIN_COLOURS = {
  healthy: '#2f5d8a',
  healthyBand: 'rgba(99, 137, 178, 0.28)',
  threshold: '#1b3550',
  required: '#3f4650',
  window: '#a97400',
  timeout: '#6b7480',
  failed: '#b3261e',
  faults: ['#8a5f00', '#545c66', '#6389b2', '#523800', '#9aa2ab', '#214262'],
};

export interface XY {
  x: number;
  y: number;
}

/** A vertical marker from y = 0 to y = top, drawn as a two-point line. */
export const verticalLine = (x: number, top: number): XY[] => [{ x, y: 0 }, { x, y: top }];

/** A horizontal marker across [from, to]. */
export const horizontalLine = (y: number, from: number, to: number): XY[] => [{ x: from, y }, { x: to, y }];

/** Bin centres and counts, scaled by `scale` (e.g. 100 for a ratio shown in %). */
export function histogramPoints(histogram: Histogram, scale = 1): XY[] {
  return histogram.counts.map((count, i) => ({ x: ((histogram.edges[i] + histogram.edges[i + 1]) / 2) * scale, y: count }));
}
