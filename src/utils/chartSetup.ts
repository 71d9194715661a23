import {
  BarElement, CategoryScale, Chart, Filler, Legend, LinearScale, LineElement, PointElement, Title, Tooltip,
  type Plugin,
} from 'chart.js';
import { niceScale } from '@shared/plot/nice-scale';

/** Paints a white ground under the chart, so a downloaded PNG is not transparent. */
const whiteGround: Plugin = {
  id: 'tv-white-ground',
  beforeDraw(chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.globalCompositeOperation = 'destination-over';
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};

Chart.register(BarElement, CategoryScale, Filler, Legend, LinearScale, LineElement, PointElement, Title, Tooltip, whiteGround);
Chart.defaults.font.family = "'Source Sans 3', system-ui, sans-serif";
Chart.defaults.color = '#3f4650';

/** Chart colours from our palettes: steel for Monte Carlo, graphite for GUM, amber for worst case. */
export const CHART_COLOURS = {
  monteCarlo: '#2f5d8a',
  monteCarloBand: 'rgba(99, 137, 178, 0.25)',
  gum: '#545c66',
  worstCase: '#a97400',
};

/** What every chart here shares: it fills its figure and draws at once, without animation. */
export const CHART_BASE = { responsive: true, maintainAspectRatio: false, animation: false } as const;
/** The same, for charts whose points are given ready as { x, y }. */
export const XY_CHART_BASE = { ...CHART_BASE, parsing: false } as const;

/** Keeps one legend entry per label (a band is drawn as two lines with the same name). */
export const uniqueLegend = {
  filter: (item: { text: string; datasetIndex?: number }, chart: { datasets: { label?: string }[] }) =>
    chart.datasets.findIndex((d) => d.label === item.text) === item.datasetIndex,
};

/** Saves a chart as a PNG file through a temporary link. */
export function downloadChart(chart: Chart | undefined | null, fileName: string): void {
  if (!chart) return;
  const link = document.createElement('a');
  link.href = chart.toBase64Image('image/png', 1);
  link.download = fileName;
  link.click();
}

/**
 * A linear axis on round ticks (1, 2 or 5 × 10^k) covering [low, high]. `padFraction` widens the range first,
 * so a marker drawn at the extreme value sits inside the plot rather than on its edge.
 */
export function roundAxis(low: number, high: number, ticks = 8, padFraction = 0) {
  const pad = (high - low) * padFraction;
  const { min, max, stepSize } = niceScale(low - pad, high + pad, ticks);
  return { type: 'linear' as const, min, max, ticks: { stepSize } };
}

/** A count axis from zero to a round top above `top` (whole numbers only). */
export function countAxis(top: number, ticks = 5) {
  const { max, stepSize } = niceScale(0, Math.max(1, top), ticks);
  return { beginAtZero: true, min: 0, max, ticks: { stepSize: Math.max(1, stepSize), precision: 0 } };
}
