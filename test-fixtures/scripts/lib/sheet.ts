import PDFDocument from 'pdfkit';

/** DejaVu carries µ, μ, Ω, Ω (ohm sign), −, °, α, θ and ≤; embedding it keeps the PDFs self-contained. */
const FONT_DIR = '/usr/share/fonts/truetype/dejavu';
const FONTS = {
  regular: `${FONT_DIR}/DejaVuSans.ttf`,
  bold: `${FONT_DIR}/DejaVuSans-Bold.ttf`,
  condensed: `${FONT_DIR}/DejaVuSansCondensed.ttf`,
  condensedBold: `${FONT_DIR}/DejaVuSansCondensed-Bold.ttf`,
};

/** A fixed date so every run writes the same bytes. */
export const FIXTURE_DATE = new Date(Date.UTC(2026, 1, 2, 9, 0, 0));

export const PAGE = { width: 595.28, height: 841.89, left: 50, right: 545, top: 62, bottom: 780 };

export interface SheetMeta {
  vendor: string;
  title: string;
  docId: string;
  revision: string;
}

export interface TextOptions {
  size?: number;
  bold?: boolean;
  condensed?: boolean;
  align?: 'left' | 'right' | 'center';
  /** For right/center alignment: the box width starting at x. */
  width?: number;
}

/** One header span of a table: text centred over columns from..to (inclusive). */
export interface HeaderSpan {
  text: string;
  from: number;
  to: number;
}

export interface TableColumn {
  width: number;
  align: 'left' | 'right' | 'center';
}

/**
 * A thin layer over pdfkit that places single-line strings at exact positions (so that
 * table cells come out as separate text items) and numbers its pages.
 */
export class Sheet {
  readonly doc: PDFKit.PDFDocument;
  private pageNo = 1;

  constructor(
    readonly meta: SheetMeta,
    options: { userPassword?: string } = {},
  ) {
    this.doc = new PDFDocument({
      size: 'A4',
      margin: 0,
      bufferPages: true,
      // RC4 (PDF 1.4) rather than AES: AES draws a random IV per stream, RC4 stays byte-stable.
      pdfVersion: options.userPassword ? '1.4' : '1.7',
      userPassword: options.userPassword,
      ownerPassword: options.userPassword ? `${options.userPassword}-owner` : undefined,
      info: {
        Title: `${meta.title} (${meta.docId})`,
        Author: meta.vendor,
        Creator: 'Shuntwise test-fixtures generator',
        Producer: 'pdfkit',
        CreationDate: FIXTURE_DATE,
        ModDate: FIXTURE_DATE,
      },
    });
    this.doc.registerFont('regular', FONTS.regular);
    this.doc.registerFont('bold', FONTS.bold);
    this.doc.registerFont('condensed', FONTS.condensed);
    this.doc.registerFont('condensedBold', FONTS.condensedBold);
    this.runningHeader();
  }

  get page(): number {
    return this.pageNo;
  }

  addPage(): void {
    this.doc.addPage({ size: 'A4', margin: 0 });
    this.pageNo++;
    this.runningHeader();
  }

  private font(o: TextOptions): void {
    const name = o.condensed ? (o.bold ? 'condensedBold' : 'condensed') : o.bold ? 'bold' : 'regular';
    this.doc.font(name).fontSize(o.size ?? 9);
  }

  widthOf(str: string, o: TextOptions = {}): number {
    this.font(o);
    return this.doc.widthOfString(str);
  }

  /** One line of text, never wrapped; y is the top of the line. */
  text(str: string, x: number, y: number, o: TextOptions = {}): void {
    if (str === '') return;
    this.font(o);
    let left = x;
    if (o.align && o.align !== 'left') {
      const w = this.doc.widthOfString(str);
      const box = o.width ?? 0;
      left = o.align === 'right' ? x + box - w : x + (box - w) / 2;
    }
    this.doc.text(str, left, y, { lineBreak: false });
  }

  /** Wrapped prose; returns the y below it. */
  paragraph(str: string, x: number, y: number, width: number, o: TextOptions = {}): number {
    this.font(o);
    this.doc.text(str, x, y, { width, lineGap: 2 });
    return this.doc.y + 4;
  }

  heading(str: string, y: number, size = 11): number {
    this.text(str, PAGE.left, y, { size, bold: true });
    return y + size + 8;
  }

  bullets(items: readonly string[], x: number, y: number, width: number, size = 9): number {
    let cy = y;
    for (const item of items) {
      this.text('•', x, cy, { size });
      cy = this.paragraph(item, x + 10, cy, width - 10, { size }) - 2;
    }
    return cy + 4;
  }

  rule(x1: number, x2: number, y: number, weight = 0.5): void {
    this.doc.moveTo(x1, y).lineTo(x2, y).lineWidth(weight).strokeColor('#555555').stroke();
  }

  box(x: number, y: number, w: number, h: number): void {
    this.doc.rect(x, y, w, h).lineWidth(0.6).strokeColor('#555555').stroke();
  }

  /** Header lines of a table (each a list of spans); returns the y below them. */
  tableHeader(x: number, y: number, columns: readonly TableColumn[], lines: readonly HeaderSpan[][], o: TextOptions & { lineHeight: number }): number {
    const lefts = columnLefts(x, columns);
    this.rule(x, lefts[columns.length], y - 3, 0.8);
    let cy = y;
    for (const line of lines) {
      for (const span of line) {
        const left = lefts[span.from];
        const width = lefts[span.to + 1] - left;
        this.text(span.text, left, cy, { ...o, align: 'center', width });
      }
      cy += o.lineHeight;
    }
    this.rule(x, lefts[columns.length], cy - 2, 0.5);
    return cy + 2;
  }

  tableRow(x: number, y: number, columns: readonly TableColumn[], cells: readonly string[], o: TextOptions): void {
    const lefts = columnLefts(x, columns);
    columns.forEach((c, i) => {
      const pad = c.align === 'left' ? 2 : c.align === 'right' ? -3 : 0;
      this.text(cells[i] ?? '', lefts[i] + pad, y, { ...o, align: c.align, width: c.width });
    });
  }

  private runningHeader(): void {
    this.text(this.meta.vendor, PAGE.left, 28, { size: 10, bold: true });
    const right = `${this.meta.title}  ·  ${this.meta.docId}  ·  Rev. ${this.meta.revision}`;
    this.text(right, PAGE.left, 29, { size: 8, align: 'right', width: PAGE.right - PAGE.left });
    this.rule(PAGE.left, PAGE.right, 44, 0.8);
  }

  /** Draws the footers (page n of N) and returns the finished PDF bytes. */
  finish(): Promise<Buffer> {
    const range = this.doc.bufferedPageRange();
    for (let i = 0; i < range.count; i++) {
      this.doc.switchToPage(range.start + i);
      this.rule(PAGE.left, PAGE.right, 800, 0.5);
      this.text(`${this.meta.vendor}. Specifications are subject to change without notice.`, PAGE.left, 806, { size: 7 });
      this.text(`Page ${i + 1} of ${range.count}`, PAGE.left, 806, { size: 7, align: 'right', width: PAGE.right - PAGE.left });
    }
    return new Promise((resolve, reject) => {
      const chunks: Buffer[] = [];
      this.doc.on('data', (c: Buffer) => chunks.push(c));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
      this.doc.end();
    });
  }
}

export function columnLefts(x: number, columns: readonly TableColumn[]): number[] {
  const lefts = [x];
  for (const c of columns) lefts.push(lefts[lefts.length - 1] + c.width);
  return lefts;
}
