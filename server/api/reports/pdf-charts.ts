import { PDF_FONTS } from './pdf-fonts.js';
import type { MarginStudyResult } from '../../../shared/schemas/margin.js';
import { formatEng } from '../../../shared/units/index.js';
import { COLOURS, type PdfWriter } from './pdf-layout.js';

interface Frame {
  x: number;
  y: number;
  w: number;
  h: number;
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
}

const px = (f: Frame, v: number) => f.x + ((v - f.xMin) / (f.xMax - f.xMin || 1)) * f.w;
const py = (f: Frame, v: number) => f.y + f.h - ((Math.min(Math.max(v, f.yMin), f.yMax) - f.yMin) / (f.yMax - f.yMin || 1)) * f.h;

function axes(pdf: PdfWriter, f: Frame, xTitle: string, yTitle: string, xLabel: (v: number) => string, yLabel: (v: number) => string): void {
  const { doc } = pdf;
  doc.save().lineWidth(0.6).strokeColor(COLOURS.muted).rect(f.x, f.y, f.w, f.h).stroke();
  doc.fontSize(7).fillColor(COLOURS.muted).font(PDF_FONTS.regular);
  for (let i = 0; i <= 5; i++) {
    const xv = f.xMin + ((f.xMax - f.xMin) * i) / 5;
    const yv = f.yMin + ((f.yMax - f.yMin) * i) / 5;
    doc.strokeColor(COLOURS.wash).moveTo(px(f, xv), f.y).lineTo(px(f, xv), f.y + f.h).stroke();
    doc.moveTo(f.x, py(f, yv)).lineTo(f.x + f.w, py(f, yv)).stroke();
    doc.text(xLabel(xv), px(f, xv) - 25, f.y + f.h + 3, { width: 50, align: 'center', lineBreak: false });
    doc.text(yLabel(yv), f.x - 44, py(f, yv) - 3, { width: 40, align: 'right', lineBreak: false });
  }
  doc.restore();
  pdf.rich(xTitle, { x: f.x, y: f.y + f.h + 14, width: f.w, align: 'center', size: 8, colour: COLOURS.muted });
  doc.save().rotate(-90, { origin: [f.x - 50, f.y + f.h / 2] });
  pdf.rich(yTitle, { x: f.x - 50 - f.h / 2, y: f.y + f.h / 2 - 4, width: f.h, align: 'center', size: 8, colour: COLOURS.muted });
  doc.restore();
}

function polyline(pdf: PdfWriter, f: Frame, xs: number[], ys: number[], colour: string, width = 1, dash?: number): void {
  const { doc } = pdf;
  doc.save().lineWidth(width).strokeColor(colour);
  if (dash) doc.dash(dash, { space: dash });
  xs.forEach((xv, i) => (i === 0 ? doc.moveTo(px(f, xv), py(f, ys[i])) : doc.lineTo(px(f, xv), py(f, ys[i]))));
  doc.stroke().restore();
}

/** A horizontal limit line; its label sits at the left, above or below the line, where rising curves leave room. */
function hline(pdf: PdfWriter, f: Frame, v: number, colour: string, label: string, below = false): void {
  polyline(pdf, f, [f.xMin, f.xMax], [v, v], colour, 1, 3);
  pdf.rich(label, { x: f.x + 4, y: py(f, v) + (below ? 2 : -10), width: 146, size: 7, colour });
}

/** A vertical line; its label at the top, or at the foot of the frame when curves crowd the top. */
function vline(pdf: PdfWriter, f: Frame, v: number, colour: string, label: string, atFoot = false): void {
  if (v < f.xMin || v > f.xMax) return;
  const { doc } = pdf;
  doc.save().lineWidth(0.8).strokeColor(colour).dash(2, { space: 2 }).moveTo(px(f, v), f.y).lineTo(px(f, v), f.y + f.h).stroke().restore();
  pdf.rich(label, { x: px(f, v) + 2, y: atFoot ? f.y + f.h - 11 : f.y + 3, width: 80, size: 7, colour });
}

function legend(pdf: PdfWriter, x: number, y: number, items: { label: string; colour: string }[]): number {
  let row = y;
  for (const item of items) {
    pdf.doc.save().rect(x, row + 2, 10, 4).fill(item.colour).restore();
    pdf.rich(item.label, { x: x + 14, y: row, width: 420, size: 7.5 });
    row += 10;
  }
  return row;
}

/** Link/pack ratio over time: healthy envelope, nominal curve, threshold, window and each fault. */
export function ratioChart(pdf: PdfWriter, r: MarginStudyResult): void {
  const c = r.charts.ratioOverTime;
  if (c.timeS.length < 2) return;
  pdf.ensure(260);
  const f: Frame = { x: pdf.left + 55, y: pdf.doc.y + 6, w: pdf.width - 65, h: 170, xMin: 0, xMax: c.timeS.at(-1)!, yMin: 0, yMax: 1 };
  const { doc } = pdf;
  doc.save().fillColor(COLOURS.wash);
  c.timeS.forEach((t, i) => (i === 0 ? doc.moveTo(px(f, t), py(f, c.healthyHighest[i])) : doc.lineTo(px(f, t), py(f, c.healthyHighest[i]))));
  for (let i = c.timeS.length - 1; i >= 0; i--) doc.lineTo(px(f, c.timeS[i]), py(f, c.healthyLowest[i]));
  doc.closePath().fill().restore();
  axes(pdf, f, 'time since pre-charge start (s)', 'true link/pack ratio (%)', (v) => formatEng(v, '', 2), (v) => `${Math.round(v * 100)}`);
  c.faults.forEach((fault, i) => polyline(pdf, f, c.timeS, fault.ratio, COLOURS.faults[i % COLOURS.faults.length], 1, 1.5));
  polyline(pdf, f, c.timeS, c.healthyNominal, COLOURS.primary, 1.4);
  hline(pdf, f, c.thresholdRatio, COLOURS.red, `closing threshold ${(c.thresholdRatio * 100).toFixed(1)} %`);
  if (c.requiredRatio !== null) hline(pdf, f, c.requiredRatio, COLOURS.amber, `required ${(c.requiredRatio * 100).toFixed(1)} %`, true);
  if (c.window) {
    vline(pdf, f, c.window.tooFastBelowS, COLOURS.muted, `too fast below ${formatEng(c.window.tooFastBelowS, 's')}`, true);
    vline(pdf, f, c.window.tooSlowAboveS, COLOURS.muted, `too slow above ${formatEng(c.window.tooSlowAboveS, 's')}`, true);
  }
  const end = legend(pdf, pdf.left, f.y + f.h + 28, [
    { label: 'healthy envelope (lowest to highest of the trials drawn)', colour: COLOURS.wash },
    { label: 'healthy nominal curve', colour: COLOURS.primary },
    ...c.faults.map((fault, i) => ({ label: fault.label, colour: COLOURS.faults[i % COLOURS.faults.length] })),
  ]);
  doc.x = pdf.left;
  doc.y = end + 8;
}

/** Histogram of the true ratio at closure with the required ratio and the threshold marked. */
export function ratioHistogram(pdf: PdfWriter, r: MarginStudyResult): void {
  const h = r.charts.ratioAtClosureHistogram;
  if (h.counts.length === 0) return;
  pdf.ensure(230);
  const marks = [h.requiredRatio, h.thresholdRatio].filter((v): v is number => v !== null);
  const xMin = Math.min(h.edges[0], ...marks) - 0.002;
  const xMax = Math.max(h.edges.at(-1)!, ...marks) + 0.002;
  const f: Frame = { x: pdf.left + 55, y: pdf.doc.y + 6, w: pdf.width - 65, h: 150, xMin, xMax, yMin: 0, yMax: Math.max(...h.counts) * 1.1 || 1 };
  const { doc } = pdf;
  axes(pdf, f, 'true link/pack ratio at closure (%)', 'trials', (v) => (v * 100).toFixed(1), (v) => String(Math.round(v)));
  doc.save().fillColor(COLOURS.primary);
  h.counts.forEach((count, i) => {
    const x0 = px(f, h.edges[i]);
    const x1 = px(f, h.edges[i + 1]);
    if (count > 0) doc.rect(x0, py(f, count), Math.max(0.5, x1 - x0 - 0.4), f.y + f.h - py(f, count)).fill();
  });
  doc.restore();
  if (h.requiredRatio !== null) vline(pdf, f, h.requiredRatio, COLOURS.amber, `required ${(h.requiredRatio * 100).toFixed(1)} %`);
  vline(pdf, f, h.thresholdRatio, COLOURS.red, `threshold ${(h.thresholdRatio * 100).toFixed(1)} %`);
  doc.x = pdf.left;
  doc.y = f.y + f.h + 32;
}
