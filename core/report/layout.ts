/**
 * Page furniture for the report: margins, headings, paragraphs, key–value blocks and ruled
 * tables that break across pages and repeat their header. Twofold's own layout: a narrow
 * slate rule beside each section heading, tables with a tinted header row and hairlines.
 */
import type PDFDocument from 'pdfkit';
import { reportFormat, type ReportFormat } from './format';
import { REPORT_LOCALES } from '../locale/locales';

type Doc = InstanceType<typeof PDFDocument>;

export const INK = '#1d2430';
export const MUTED = '#5b6575';
export const ACCENT = '#2f5d7c';
export const TINT = '#e8eef3';
export const WARN = '#8a3b12';

export interface Fonts {
  readonly regular: string;
  readonly bold: string;
}

export interface Column {
  readonly header: string;
  /** Share of the text width. */
  readonly width: number;
  readonly align?: 'left' | 'right' | 'center';
}

export class Layout {
  constructor(
    readonly doc: Doc,
    readonly fonts: Fonts,
    /** Numbers and dates in the report's locale (neutral by default). */
    readonly f: ReportFormat = reportFormat(REPORT_LOCALES[0]),
  ) {}

  get left(): number {
    return this.doc.page.margins.left;
  }

  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }

  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  /** Starts a new page unless `height` points still fit. */
  ensure(height: number): void {
    if (this.doc.y + height > this.bottom) this.doc.addPage();
  }

  heading(text: string): void {
    this.ensure(60);
    const doc = this.doc;
    doc.moveDown(0.6);
    const y = doc.y;
    doc.rect(this.left, y + 1, 3, 13).fill(ACCENT);
    doc.fillColor(INK).font(this.fonts.bold).fontSize(12.5).text(text, this.left + 9, y, { width: this.width - 9 });
    doc.moveDown(0.3);
    doc.x = this.left;
  }

  subheading(text: string): void {
    this.ensure(40);
    this.doc.moveDown(0.3);
    this.doc.fillColor(ACCENT).font(this.fonts.bold).fontSize(10).text(text, this.left, this.doc.y, { width: this.width });
    this.doc.moveDown(0.15);
  }

  paragraph(text: string, options: { size?: number; color?: string; bold?: boolean } = {}): void {
    const doc = this.doc;
    doc.font(options.bold ? this.fonts.bold : this.fonts.regular).fontSize(options.size ?? 9).fillColor(options.color ?? INK);
    this.ensure(doc.heightOfString(text, { width: this.width }) + 2);
    doc.text(text, this.left, doc.y, { width: this.width, lineGap: 1 });
    doc.moveDown(0.25);
  }

  /** Label–value pairs in two columns of pairs. */
  facts(pairs: readonly (readonly [string, string])[]): void {
    const doc = this.doc;
    const half = this.width / 2;
    const labelW = 92;
    for (let i = 0; i < pairs.length; i += 2) {
      this.ensure(14);
      const y = doc.y;
      let next = y;
      for (let j = 0; j < 2 && i + j < pairs.length; j++) {
        const [label, value] = pairs[i + j];
        const x = this.left + j * half;
        doc.font(this.fonts.regular).fontSize(8).fillColor(MUTED).text(label, x, y + 0.5, { width: labelW });
        doc.font(this.fonts.regular).fontSize(9).fillColor(INK).text(value, x + labelW, y, { width: half - labelW - 6 });
        next = Math.max(next, doc.y);
      }
      doc.y = next + 2;
    }
    doc.x = this.left;
  }

  /** A ruled table; a row starting on a new page is preceded by the header again. */
  table(columns: readonly Column[], rows: readonly (readonly string[])[], options: { size?: number } = {}): void {
    const doc = this.doc;
    const size = options.size ?? 8;
    const widths = columns.map((c) => c.width * this.width);
    const pad = 3;
    const rowHeight = (cells: readonly string[], font: string) => {
      doc.font(font).fontSize(size);
      return Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: widths[i] - 2 * pad }))) + 2 * pad;
    };
    const drawRow = (cells: readonly string[], header: boolean, h: number) => {
      const y = doc.y;
      if (header) doc.rect(this.left, y, this.width, h).fill(TINT);
      let x = this.left;
      cells.forEach((cell, i) => {
        doc.font(header ? this.fonts.bold : this.fonts.regular).fontSize(size).fillColor(header ? ACCENT : INK);
        doc.text(cell, x + pad, y + pad, { width: widths[i] - 2 * pad, align: columns[i].align ?? 'left' });
        x += widths[i];
      });
      doc.moveTo(this.left, y + h).lineTo(this.left + this.width, y + h).lineWidth(0.4).strokeColor('#b9c3cf').stroke();
      doc.x = this.left;
      doc.y = y + h;
    };
    const headers = columns.map((c) => c.header);
    // Each row is measured once: measuring wraps the text, which is most of a table's cost.
    const headerHeight = rowHeight(headers, this.fonts.bold);
    const heights = rows.map((row) => rowHeight(row, this.fonts.regular));
    this.ensure(headerHeight + (heights[0] ?? 0));
    drawRow(headers, true, headerHeight);
    rows.forEach((row, i) => {
      if (doc.y + heights[i] > this.bottom) {
        doc.addPage();
        drawRow(headers, true, headerHeight);
      }
      drawRow(row, false, heights[i]);
    });
    doc.moveDown(0.4);
  }

  /** A boxed note, e.g. the cautions or the demonstration notice. */
  notice(title: string, text: string, color: string): void {
    const doc = this.doc;
    const inner = this.width - 16;
    doc.font(this.fonts.regular).fontSize(8.5);
    const h = doc.heightOfString(text, { width: inner }) + 24;
    this.ensure(h + 6);
    const y = doc.y;
    doc.rect(this.left, y, this.width, h).lineWidth(0.8).strokeColor(color).stroke();
    doc.font(this.fonts.bold).fontSize(9).fillColor(color).text(title, this.left + 8, y + 6, { width: inner });
    doc.font(this.fonts.regular).fontSize(8.5).fillColor(INK).text(text, this.left + 8, doc.y + 1, { width: inner });
    doc.x = this.left;
    doc.y = y + h + 6;
  }
}
