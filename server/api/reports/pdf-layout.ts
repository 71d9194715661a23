import { PDF_FONTS, pdfFontFiles } from './pdf-fonts.js';
import PDFDocument from 'pdfkit';
import { textRuns } from './pdf-text.js';

export const COLOURS = {
  ink: '#1d2430', muted: '#5b6472', rule: '#c9ced6', primary: '#2F5D8A', wash: '#dbe6f1', amber: '#C98A00', red: '#B3261E',
  faults: ['#7a3ea8', '#B3261E', '#1f7a5a', '#C98A00', '#8a5a2f', '#3c8fb5'],
};

export interface Column {
  header: string;
  width: number;
  align?: 'left' | 'right';
}

/** A pdfkit document with the few layout verbs the report needs: headings, paragraphs, tables, page breaks. */
export class PdfWriter {
  readonly doc: PDFKit.PDFDocument;
  readonly left = 50;
  readonly width: number;

  constructor(title: string) {
    this.doc = new PDFDocument({ size: 'A4', margin: 50, bufferPages: true, info: { Title: title, Creator: 'Tallyvolt' } });
    for (const [name, bytes] of Object.entries(pdfFontFiles())) this.doc.registerFont(name, bytes);
    this.width = this.doc.page.width - 100;
    this.doc.font(PDF_FONTS.regular).fontSize(10).fillColor(COLOURS.ink);
  }

  get bottom(): number {
    return this.doc.page.height - 60;
  }

  /** Starts a new page when less than `height` points are left. */
  ensure(height: number): void {
    if (this.doc.y + height > this.bottom) {
      this.doc.addPage();
      this.doc.x = this.left;
    }
  }

  /** Draws text in Source Sans 3, switching to its Greek subset for Ω, τ, µ and the like. */
  rich(text: string, options: PDFKit.Mixins.TextOptions & { x?: number; y?: number; bold?: boolean; size?: number; colour?: string } = {}): void {
    const { x, y, bold, size, colour, ...rest } = options;
    const runs = textRuns(text, bold);
    if (runs.length === 0) return;
    this.doc.fontSize(size ?? 10).fillColor(colour ?? COLOURS.ink);
    runs.forEach((run, i) => {
      this.doc.font(run.font);
      const last = i === runs.length - 1;
      if (i === 0 && x !== undefined) this.doc.text(run.text, x, y, { ...rest, continued: !last });
      else this.doc.text(run.text, { ...rest, continued: !last });
    });
    this.doc.font(PDF_FONTS.regular).fillColor(COLOURS.ink);
  }

  heading(text: string, level: 1 | 2 = 1): void {
    this.ensure(level === 1 ? 60 : 40);
    this.doc.moveDown(level === 1 ? 0.8 : 0.5);
    this.rich(text, { x: this.left, bold: true, size: level === 1 ? 14 : 11, colour: level === 1 ? COLOURS.primary : COLOURS.ink });
    this.doc.moveDown(0.3);
  }

  paragraph(text: string, options: { size?: number; colour?: string; bold?: boolean } = {}): void {
    this.ensure(30);
    this.rich(text, { x: this.left, width: this.width, ...options });
    this.doc.moveDown(0.3);
  }

  /** A table with a header row; rows break across pages and repeat the header. */
  table(columns: Column[], rows: string[][], options: { size?: number; colourOf?: (row: number, col: number) => string | undefined } = {}): void {
    const size = options.size ?? 8.5;
    const drawHeader = () => {
      const y = this.doc.y;
      let x = this.left;
      for (const c of columns) {
        this.rich(c.header, { x: x + 2, y, width: c.width - 4, align: c.align ?? 'left', bold: true, size, colour: COLOURS.muted });
        x += c.width;
      }
      this.doc.y = y + size + 5;
      this.rule();
    };
    this.ensure(3 * (size + 6));
    drawHeader();
    rows.forEach((cells, r) => {
      this.doc.fontSize(size).font(PDF_FONTS.regular);
      const height = Math.max(...cells.map((cell, i) => this.doc.heightOfString(cell.replace(/[^\x20-\x7e\xa0-\xff]/g, 'W'), { width: columns[i].width - 4 }))) + 4;
      if (this.doc.y + height > this.bottom) {
        this.doc.addPage();
        drawHeader();
      }
      const y = this.doc.y;
      let x = this.left;
      cells.forEach((cell, i) => {
        this.rich(cell, { x: x + 2, y: y + 2, width: columns[i].width - 4, align: columns[i].align ?? 'left', size, colour: options.colourOf?.(r, i) });
        x += columns[i].width;
      });
      this.doc.y = y + height;
      this.rule(COLOURS.wash);
    });
    this.doc.x = this.left;
    this.doc.moveDown(0.5);
  }

  rule(colour = COLOURS.rule): void {
    this.doc.save().strokeColor(colour).lineWidth(0.5).moveTo(this.left, this.doc.y).lineTo(this.left + this.width, this.doc.y).stroke().restore();
    this.doc.y += 2;
  }

  /** Page numbers and the short caution on every page (needs bufferPages). */
  footer(text: string): void {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const y = this.doc.page.height - 40;
      const marginBottom = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      this.doc.font(PDF_FONTS.regular).fontSize(7.5).fillColor(COLOURS.muted)
        .text(`${text}  ·  page ${i + 1} of ${range.count}`, this.left, y, { width: this.width, align: 'center', lineBreak: false });
      this.doc.page.margins.bottom = marginBottom;
    }
  }

  /** Ends the document and collects its bytes. */
  finish(): Promise<Buffer> {
    const chunks: Buffer[] = [];
    return new Promise((resolve, reject) => {
      this.doc.on('data', (c: Buffer) => chunks.push(c));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
      this.doc.end();
    });
  }
}
