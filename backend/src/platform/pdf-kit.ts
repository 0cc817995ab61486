import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';

/**
 * Shared PDF plumbing for report exports: Open Sans shipped via @fontsource (pdfkit's fontkit reads WOFF, so no
 * system fonts or binaries), a title block, simple tables and a vector bar chart.
 */
const require = createRequire(import.meta.url);
const FONT_REGULAR = require.resolve('@fontsource/open-sans/files/open-sans-latin-400-normal.woff');
const FONT_BOLD = require.resolve('@fontsource/open-sans/files/open-sans-latin-700-normal.woff');
const INK = '#1f2a30';
const MUTED = '#5b6770';

export type Pdf = PDFKit.PDFDocument;

export function newPdf(title: string): Pdf {
  const doc = new PDFDocument({
    size: 'LETTER',
    margin: 50,
    info: { Title: title, Producer: 'Rillmark', Creator: 'Rillmark' },
  });
  doc.registerFont('body', FONT_REGULAR);
  doc.registerFont('bold', FONT_BOLD);
  doc.font('body').fillColor(INK);
  return doc;
}

/** Renders to a Buffer, so an error while drawing becomes a 500 instead of a truncated download. */
export function render(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

export function heading(doc: Pdf, text: string, size = 16): void {
  doc.moveDown(0.5).font('bold').fontSize(size).fillColor(INK).text(text).font('body').fontSize(10);
}

/** The shipped Latin subset lacks a few math signs used on screen; spell them out rather than print blanks. */
export function latinOnly(text: string): string {
  return text.replaceAll('≤', 'at most').replaceAll('≥', 'at least').replaceAll('−', '-');
}

export function paragraph(doc: Pdf, text: string, color = INK): void {
  doc.font('body').fontSize(10).fillColor(color).text(latinOnly(text), { align: 'left' }).moveDown(0.3).fillColor(INK);
}

export function muted(doc: Pdf, text: string): void {
  paragraph(doc, text, MUTED);
}

/** A plain table; widths in points, numbers right-aligned by the caller passing `align`. */
export function table(
  doc: Pdf,
  headers: string[],
  rows: string[][],
  widths: number[],
  align: ('left' | 'right')[] = [],
): void {
  const x0 = doc.page.margins.left;
  const drawRow = (cells: string[], bold: boolean) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 30) doc.addPage();
    const y = doc.y;
    let x = x0;
    let height = 0;
    doc.font(bold ? 'bold' : 'body').fontSize(8.5);
    cells.forEach((cell, i) => {
      const w = widths[i]!;
      doc.text(latinOnly(cell), x + 2, y, { width: w - 4, align: align[i] ?? 'left' });
      height = Math.max(height, doc.y - y);
      x += w;
    });
    doc.y = y + height + 3;
    doc
      .moveTo(x0, doc.y - 1.5)
      .lineTo(x0 + widths.reduce((s, w) => s + w, 0), doc.y - 1.5)
      .lineWidth(0.3)
      .strokeColor('#c8d0d4')
      .stroke();
  };
  drawRow(headers, true);
  rows.forEach((r) => drawRow(r, false));
  doc.x = x0;
  doc.font('body').fontSize(10);
}

/** Grouped bars per label (two series), y axis in `unit`, legend under the chart. Vector only. */
export function barChart(
  doc: Pdf,
  labels: string[],
  series: { name: string; color: string; values: (number | null)[] }[],
  unit: string,
  height = 170,
): void {
  const x0 = doc.page.margins.left + 50;
  const width = doc.page.width - doc.page.margins.right - x0;
  if (doc.y + height + 50 > doc.page.height - doc.page.margins.bottom) doc.addPage();
  const top = doc.y + 5;
  const max = Math.max(1, ...series.flatMap((s) => s.values.map((v) => v ?? 0)));
  const scale = niceCeiling(max);
  doc.fontSize(7).fillColor(MUTED);
  for (let i = 0; i <= 4; i++) {
    const y = top + height - (height * i) / 4;
    doc
      .moveTo(x0, y)
      .lineTo(x0 + width, y)
      .lineWidth(0.3)
      .strokeColor('#dde3e6')
      .stroke();
    doc.text(`${Math.round((scale * i) / 4).toLocaleString('en-US')}`, x0 - 50, y - 4, { width: 46, align: 'right' });
  }
  doc.text(unit, x0 - 50, top - 12, { width: 60 });
  const group = width / Math.max(1, labels.length);
  const bar = Math.min(14, (group * 0.8) / series.length);
  labels.forEach((label, i) => {
    series.forEach((s, j) => {
      const v = s.values[i];
      if (v === null || v === undefined || v <= 0) return;
      const h = (height * v) / scale;
      doc
        .rect(x0 + i * group + (group - bar * series.length) / 2 + j * bar, top + height - h, bar - 1, h)
        .fill(s.color);
    });
    doc
      .fillColor(MUTED)
      .fontSize(6.5)
      .text(label, x0 + i * group, top + height + 3, { width: group, align: 'center' });
  });
  let lx = x0;
  const ly = top + height + 16;
  for (const s of series) {
    doc.rect(lx, ly, 8, 8).fill(s.color);
    doc
      .fillColor(INK)
      .fontSize(8)
      .text(s.name, lx + 12, ly, { lineBreak: false });
    lx += 24 + doc.widthOfString(s.name);
  }
  doc.x = doc.page.margins.left;
  doc.y = ly + 18;
  doc.fillColor(INK).fontSize(10);
}

function niceCeiling(v: number): number {
  const magnitude = 10 ** Math.floor(Math.log10(v));
  return [1, 2, 2.5, 5, 10].map((m) => m * magnitude).find((c) => c >= v)!;
}

export const fmt = {
  gal: (v: number | null) => (v === null ? '—' : `${Math.round(v).toLocaleString('en-US')} gal`),
  pct: (v: number | null, d = 1) => (v === null ? '—' : `${v.toFixed(d)} %`),
  money: (v: number | null, currency: string | null) =>
    v === null || currency === null
      ? '—'
      : `${v.toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })} ${currency}`,
  mm: (v: number) => `${v.toFixed(1)} mm`,
};
