import { COLOURS, type PdfWriter } from './pdf-layout.js';
import type { ReviewReport } from './reports.service.js';

const AGAINST = { previous: 'the revision it was started from', approved: 'the last approved revision' } as const;

/** The revision against the previous and the last approved one: every changed value old → new, as the review shows it. */
export function comparisonSection(pdf: PdfWriter, report: ReviewReport): void {
  const comparisons = report.comparisons;
  if (!comparisons) return;
  pdf.heading('Revision comparison');
  if (comparisons.length === 0) {
    pdf.paragraph(`Revision ${report.revision.letter} is the first revision: there is nothing to compare it with.`, { size: 9 });
    return;
  }
  const letter = report.revision.letter;
  for (const c of comparisons) {
    pdf.heading(`Against revision ${c.revision.letter} (${c.revision.stateLabel.toLowerCase()})`, 2);
    const changed = c.rows.filter((r) => r.changed);
    pdf.paragraph(`Compared with ${c.against.map((a) => AGAINST[a]).join(' and ')}: ${changed.length === 0 ? `all ${c.rows.length} values are the same.`
      : `${changed.length} of ${c.rows.length} values differ and are listed, marked changed; the others are the same.`}`, { size: 8.5, colour: COLOURS.muted });
    if (changed.length === 0) continue;
    pdf.table(
      [{ header: 'Where', width: 120 }, { header: 'Value', width: 130 }, { header: `Revision ${c.revision.letter}`, width: 95, align: 'right' },
        { header: `Revision ${letter}`, width: 95, align: 'right' }, { header: '', width: pdf.width - 440 }],
      changed.map((r) => [r.section, r.label, r.before ?? '-', r.after ?? '-', 'changed']),
      { colourOf: (_row, col) => (col === 4 ? COLOURS.amber : undefined) },
    );
  }
}
