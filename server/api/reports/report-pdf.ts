import type { MarginCriterion, MarginStudyResult } from '../../../shared/schemas/margin.js';
import { budgetRowTexts, formatEng } from '../../../shared/units/index.js';
import { GUM_AGREEMENT_WORDS } from '../../../shared/propagation/gum-validation.js';
import { ratioChart, ratioHistogram } from './pdf-charts.js';
import { COLOURS, PdfWriter } from './pdf-layout.js';
import { comparisonSection } from './pdf-comparison.js';
import type { ReviewReport } from './reports.service.js';

const when = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace('T', ' ')} UTC` : '-');
const prob = (p: number) => (p === 0 ? '0' : p < 1e-3 ? p.toExponential(1) : p.toPrecision(2));

function criterionValue(c: MarginCriterion, v: number | null): string {
  if (v === null) return '-';
  if (c.sense === 'detected') return `${(v * 100).toFixed(1)} % caught`;
  if (c.unit === '') return prob(v);
  if (c.unit === '%') return `${v.toFixed(2)} %`;
  return formatEng(v, c.unit);
}

const VERDICT_TEXT = { pass: 'PASS: every criterion holds', fail: 'FAIL: see the failed criteria', 'unable-to-close': 'UNABLE TO CLOSE: the healthy pre-charge never reaches the threshold',
  'not-shown': 'NOT SHOWN: nothing fails, but some criterion needs more trials or simulated boards to be shown met' } as const;

function caution(pdf: PdfWriter, report: ReviewReport): void {
  const { doc } = pdf;
  const top = doc.y;
  doc.x = pdf.left + 12;
  pdf.rich(report.caution.title, { x: pdf.left + 12, y: top + 8, bold: true, size: 10.5, colour: COLOURS.red, width: pdf.width - 24 });
  for (const p of report.caution.paragraphs) {
    doc.moveDown(0.2);
    pdf.rich(p, { x: pdf.left + 12, width: pdf.width - 24, size: 8.5 });
  }
  const bottom = doc.y + 8;
  doc.save().lineWidth(1).strokeColor(COLOURS.red).rect(pdf.left, top, pdf.width, bottom - top).stroke()
    .rect(pdf.left, top, 5, bottom - top).fill(COLOURS.red).restore();
  doc.x = pdf.left;
  doc.y = bottom + 10;
}

function marginSection(pdf: PdfWriter, report: ReviewReport): void {
  pdf.heading('Margin summary');
  const margin = report.margin;
  if (!margin) {
    pdf.paragraph('No finished margin study.', { colour: COLOURS.red });
    return;
  }
  const r: MarginStudyResult = margin.result;
  pdf.paragraph(`Study ${margin.runId}, ${r.trials} trials, seed ${r.seed}, finished ${when(margin.finishedAt)}${margin.current ? '' : ' - NOT CURRENT: the inputs changed after it ran'}.`,
    { size: 8.5, colour: margin.current ? COLOURS.muted : COLOURS.red });
  pdf.paragraph(VERDICT_TEXT[r.verdict], { bold: true, colour: r.verdict === 'pass' ? COLOURS.primary : COLOURS.red });
  pdf.table(
    [{ header: 'Criterion', width: 170 }, { header: 'Result', width: 40 }, { header: 'Value', width: 70, align: 'right' }, { header: 'Limit', width: 60, align: 'right' }, { header: 'Why', width: pdf.width - 340 }],
    r.summary.map((c) => [c.criterion, c.pass ? 'pass' : c.outcome === 'not-shown' ? 'NOT SHOWN' : 'FAIL', criterionValue(c, c.value), criterionValue(c, c.limit), c.explanation]),
    { colourOf: (row, col) => (col === 1 ? (r.summary[row].pass ? COLOURS.primary : COLOURS.red) : undefined) },
  );
  const i = margin.inputs;
  pdf.heading('Margin inputs', 2);
  pdf.table([{ header: 'Input', width: 200 }, { header: 'Value', width: pdf.width - 200 }], [
    ['pack voltage', `${formatEng(i.packMinV, 'V')} to ${formatEng(i.packMaxV, 'V')}`],
    ['closing threshold', `${i.closingThresholdPct} % of the pack reading, ${i.consecutiveReadings} consecutive readings every ${formatEng(i.updateIntervalS, 's')}`],
    ['required at closure', [i.requiredRatioPct !== undefined ? `true ratio ≥ ${i.requiredRatioPct} %` : '', i.maxStepV !== undefined ? `step ≤ ${formatEng(i.maxStepV, 'V')}` : ''].filter(Boolean).join(', ')],
    ['pre-charge resistance', `${formatEng(i.prechargeOhm, 'Ω')} ±${i.prechargeTolerancePct} %`],
    ['link capacitance', `${formatEng(i.linkCapacitanceF, 'F')} ±${i.capacitanceTolerancePct} %`],
    ['link-side leakage', r.model.leakagePaths.map((p) => `${p.label} ${formatEng(p.resistanceOhm, 'Ω')}`).join('; ') + (r.model.leakageOhm ? ` (together ${formatEng(r.model.leakageOhm, 'Ω')})` : '')],
    ['timeout', formatEng(i.timeoutS, 's')],
    ['reading errors', r.model.readingErrors.description],
    ...r.model.readingErrors.channels.map((c) => [`${c.name} spread (1 σ)`, `gain ${(c.gainSigmaFraction * 100).toFixed(3)} %, offset ${formatEng(c.offsetSigmaV, 'V')}`]),
    ['plausibility margin', `${i.plausibilityMarginPct} %; allowed probability ${prob(i.allowedProbability)}`],
  ]);
  pdf.heading('Closure', 2);
  const q = r.closureTimeS?.quantiles ?? [];
  pdf.table([{ header: 'Quantity', width: 200 }, ...q.map((x) => ({ header: `${x.probability * 100} %`, width: (pdf.width - 200) / q.length, align: 'right' as const }))], [
    ['closure time', ...q.map((x) => formatEng(x.value, 's'))],
    ['true ratio at closure', ...(r.ratioAtClosure?.quantiles ?? []).map((x) => `${(x.value * 100).toFixed(2)} %`)],
    ['voltage step at closure', ...(r.stepAtClosureV?.quantiles ?? []).map((x) => formatEng(x.value, 'V'))],
  ]);
  pdf.heading('Fault verdicts', 2);
  const window = r.window ? `Plausibility window ${formatEng(r.window.tooFastBelowS, 's')} to ${formatEng(r.window.tooSlowAboveS, 's')} (margin ${(r.window.marginFraction * 100).toFixed(0)} %).` : 'No plausibility window: the healthy pre-charge does not close.';
  pdf.paragraph(window, { size: 8.5 });
  const verdict = { 'too-fast': 'too fast', 'too-slow': 'too slow', 'not-detected': 'NOT DETECTED', 'not-evaluated': 'not evaluated' } as const;
  pdf.table(
    [{ header: 'Fault case', width: 170 }, { header: 'Verdict', width: 80 }, { header: 'Too fast', width: 55, align: 'right' }, { header: 'Too slow', width: 55, align: 'right' }, { header: 'Missed', width: 55, align: 'right' }, { header: 'Nominal closure', width: pdf.width - 415, align: 'right' }],
    r.faults.map((f) => [f.label, verdict[f.verdict], ...[f.tooFastFraction, f.tooSlowFraction, f.notDetectedFraction].map((x) => (x === null ? '-' : `${(x * 100).toFixed(1)} %`)),
      f.nominalCloseS === null ? 'never' : formatEng(f.nominalCloseS, 's')]),
    { colourOf: (row, col) => (col === 1 ? (['too-fast', 'too-slow'].includes(r.faults[row].verdict) ? COLOURS.primary : COLOURS.red) : undefined) },
  );
  pdf.ensure(300);
  pdf.heading('Link/pack ratio over time', 2);
  ratioChart(pdf, r);
  pdf.ensure(250);
  pdf.heading('True ratio at closure', 2);
  ratioHistogram(pdf, r);
}

function uncertaintySection(pdf: PdfWriter, report: ReviewReport): void {
  pdf.heading('Uncertainty study');
  const u = report.uncertainty;
  if (!u) {
    pdf.paragraph('No finished uncertainty study.', { colour: COLOURS.red });
    return;
  }
  pdf.paragraph(`Study ${u.runId}, seed ${u.seed}, finished ${when(u.finishedAt)}${u.current ? '' : ' - NOT CURRENT: the channels changed after it ran'}.`,
    { size: 8.5, colour: u.current ? COLOURS.muted : COLOURS.red });
  for (const c of u.channels) {
    pdf.heading(`${c.name}: reading error, ${c.trials} Monte Carlo trials, p = ${c.coverageProbability}`, 2);
    if (c.counterOverflowV?.length) {
      pdf.paragraph(`Counter overflows at ${c.counterOverflowV.map((v) => formatEng(v, 'V')).join(', ')}: the firmware reads those counts modulo the counter's width, and the figures there include the wrong reading that gives.`,
        { size: 8.5, bold: true });
    }
    pdf.table(
      [{ header: 'Voltage', width: 80, align: 'right' }, { header: 'Monte Carlo mean', width: 100, align: 'right' }, { header: 'Monte Carlo interval', width: 140, align: 'right' }, { header: 'GUM U', width: 80, align: 'right' }, { header: 'Worst case', width: pdf.width - 400, align: 'right' }],
      c.points.map((p) => [formatEng(p.voltageV, 'V'), formatEng(p.monteCarloMeanV, 'V'), `${formatEng(p.monteCarloIntervalV.low, 'V')} to ${formatEng(p.monteCarloIntervalV.high, 'V')}`,
        `±${formatEng(p.gumExpandedUncertaintyV, 'V')}`, `±${formatEng(p.worstCaseMaxAbsV, 'V')}`]),
    );
    pdf.paragraph(`Uncertainty budget at ${formatEng(c.budget.voltageV, 'V')}: u = ${formatEng(c.budget.combinedStandardUncertaintyV, 'V')}, U = ±${formatEng(c.budget.expandedUncertaintyV, 'V')} (k = ${c.budget.coverageFactor.toFixed(2)}); GUM against Monte Carlo (JCGM 101 §8): ${GUM_AGREEMENT_WORDS[c.gumAgreement ?? (c.gumAdequate ? 'agrees' : 'disagrees')]}.`, { size: 8.5 });
    pdf.table(
      [{ header: 'Term', width: 132 }, { header: 'Distribution', width: 60 }, { header: 'Bound', width: 60, align: 'right' }, { header: 'u(x)', width: 58, align: 'right' },
        { header: 'Sensitivity c', width: 80, align: 'right' }, { header: 'u(y)', width: 50, align: 'right' }, { header: 'Share', width: pdf.width - 440, align: 'right' }],
      // the same cells as the printable report page, from the same shared helper
      c.budget.rows.map((b) => { const t = budgetRowTexts(b); return [t.term, t.distribution, t.bound, t.standardUncertainty, t.sensitivity, t.contribution, t.share]; }),
    );
    if (c.budget.rows.some((b) => b.order === 2)) {
      pdf.paragraph('Second-order rows are cross terms of two inputs (JCGM 100 5.1.2, note on nonlinearity), such as a temperature swing acting through a TCR; their u(x) is the product of the two inputs\' and they count in u.', { size: 8, colour: COLOURS.muted });
    }
  }
}

function chainSection(pdf: PdfWriter, report: ReviewReport): void {
  for (const channel of report.channels) {
    pdf.heading(`Chain: ${channel.name} (${channel.key})`);
    for (const stage of channel.stages) {
      pdf.heading(stage.stage, 2);
      pdf.table([{ header: 'Parameter', width: 220 }, { header: 'Value', width: pdf.width - 220 }], stage.rows.map((r) => [r.label, r.text]));
    }
    for (const w of channel.warnings ?? []) {
      pdf.paragraph(`${w.level === 'info' ? 'Not checked' : 'Warning'}: ${w.message}`, { size: 8.5, colour: w.level === 'info' ? COLOURS.muted : COLOURS.ink });
    }
  }
}

/** Each approval given against failing checks: what failed then, and the approver's written justification. */
function overrides(pdf: PdfWriter, report: ReviewReport): void {
  for (const e of report.signOff) {
    if (!e.override) continue;
    pdf.paragraph(`Override: approved by ${e.actor.displayName ?? 'someone no longer on the team'} on ${when(e.at)} against ${e.override.failing.length === 1 ? 'a failing check' : `${e.override.failing.length} failing checks`}:`,
      { bold: true, colour: COLOURS.red, size: 9 });
    for (const f of e.override.failing) pdf.paragraph(`- ${f.label}`, { size: 9 });
    pdf.paragraph(`Justification: ${e.override.justification}`, { size: 9 });
  }
}

/** The review report as a PDF: caution, margin summary and charts, uncertainty, chains, sign-off. */
export function renderReportPdf(report: ReviewReport): Promise<Buffer> {
  const pdf = new PdfWriter(`Review report: ${report.title}`);
  pdf.rich('Tallyvolt review report', { x: pdf.left, y: 50, size: 9, colour: COLOURS.muted });
  pdf.rich(report.title, { x: pdf.left, bold: true, size: 18, colour: COLOURS.primary });
  pdf.paragraph(`${report.revision.stateLabel}. Design owner ${report.design.owner.displayName}; revision by ${report.revision.createdBy.displayName}. Generated ${when(report.generatedAt)}.`, { size: 9 });
  if (report.design.purpose) pdf.paragraph(report.design.purpose, { size: 9, colour: COLOURS.muted });
  if (report.revision.note) pdf.paragraph(`Revision note: ${report.revision.note}`, { size: 9 });
  pdf.doc.moveDown(0.5);
  caution(pdf, report);
  comparisonSection(pdf, report);
  marginSection(pdf, report);
  uncertaintySection(pdf, report);
  chainSection(pdf, report);
  pdf.heading('Sign-off history');
  if (report.signOff.length === 0) pdf.paragraph('Not yet submitted for review.');
  else {
    pdf.table([{ header: 'When', width: 110 }, { header: 'What', width: 110 }, { header: 'Who', width: 110 }, { header: 'Comment', width: pdf.width - 330 }],
      report.signOff.map((e) => [when(e.at), e.label, e.actor.displayName ?? '-', e.comment]));
    overrides(pdf, report);
  }
  pdf.footer(`${report.title}  ·  High voltage: qualified people only. Tallyvolt checks arithmetic and certifies nothing.`);
  return pdf.finish();
}
