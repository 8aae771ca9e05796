import PDFDocument from 'pdfkit';
import { HeaderSpan, PAGE, Sheet, TextOptions } from '../sheet';
import { Field } from '../types';
import { LayoutChoices } from './choices';
import { PartModel, Val } from './model';

/**
 * Drawing for the random datasheets: text placed per line, per word or per glyph; the
 * vendor's decimal sign; pages turned by 90°; a flow of blocks over one or two columns;
 * and the answer key, recorded as values are printed.
 */

export interface Frame {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** A landscape frame on a portrait page turned by 90° (coordinates before turning). */
const ROTATED: Frame = { left: 60, right: PAGE.height - 60, top: 40, bottom: PAGE.width - 40 };

export interface RecordedValue extends Val {
  page: number;
}

/**
 * Parsing DejaVu takes most of the time of a small document; hundreds of documents in one
 * test run share the parsed fonts. pdfkit parses a registered font file anew for every
 * document, so its font() is wrapped once to hand later documents the parsed font (each
 * document still keeps its own subset and layout cache, and starts with an empty glyph cache,
 * so the bytes are the same as when it is made alone; the random-layout test checks that).
 */
interface FontDoc {
  _registeredFonts: Record<string, { src: unknown }>;
  _fontFamilies: Record<string, { name: string; font: unknown; constructor: unknown }>;
  _fontCount: number;
  _font: { font: unknown; constructor: unknown };
}
type EmbeddedFontClass = new (doc: FontDoc, font: unknown, id: string) => { name: string; font: unknown; constructor: unknown };
let fontsShared = false;
function shareParsedFonts(): void {
  if (fontsShared) return;
  fontsShared = true;
  const proto = PDFDocument.prototype as unknown as { font: (this: FontDoc, src: unknown, ...rest: unknown[]) => unknown };
  const original = proto.font;
  const parsed = new Map<string, unknown>();
  let Embedded: EmbeddedFontClass | undefined;
  proto.font = function (this: FontDoc, src: unknown, ...rest: unknown[]) {
    const reg = typeof src === 'string' ? this._registeredFonts[src] : undefined;
    const path = reg && typeof reg.src === 'string' ? reg.src : undefined;
    if (path && Embedded && parsed.has(path) && !this._fontFamilies[src as string]) {
      // fontkit keeps each glyph with the code point it was first asked for, and pdfkit writes
      // that code point into the text layer: U+2126 and U+03A9 (or U+00B5 and U+03BC) share a
      // glyph, so a shared cache would print what an earlier document asked for. Each document
      // starts with an empty glyph cache: its bytes are the same as when made alone.
      (parsed.get(path) as { _glyphs: Record<number, unknown> })._glyphs = {};
      const f = new Embedded(this, parsed.get(path), `F${++this._fontCount}`);
      this._fontFamilies[src as string] = f;
      this._fontFamilies[f.name] = f;
    }
    const out = original.call(this, src, ...rest);
    if (path && !parsed.has(path)) {
      parsed.set(path, this._font.font);
      Embedded = this._font.constructor as EmbeddedFontClass;
    }
    return out;
  };
}

export class Pen {
  readonly sheet: Sheet;
  frame: Frame = { ...PAGE };
  private rotated = false;
  readonly answers = new Map<string, { package: { value: string; page: number }; fields: Partial<Record<Field, RecordedValue>> }>();

  constructor(
    readonly c: LayoutChoices,
    meta: { vendor: string; title: string; docId: string; revision: string },
  ) {
    shareParsedFonts();
    this.sheet = new Sheet(meta);
  }

  get doc(): PDFKit.PDFDocument {
    return this.sheet.doc;
  }

  get page(): number {
    return this.sheet.page;
  }

  /** A number as the vendor prints it: decimal comma or point. */
  num(v: string): string {
    return this.c.decimal === 'comma' ? v.replace(/(\d)\.(\d)/g, '$1,$2') : v;
  }

  /** Value and unit as one string ("5,1 V", "30 ohm"). */
  vu(v: Val): string {
    return `${this.num(v.value)} ${v.unit}`;
  }

  newPage(rotated = false): void {
    if (this.rotated) this.doc.restore();
    this.sheet.addPage();
    this.rotated = rotated;
    if (rotated) {
      // Turn the drawing by 90° so that a landscape table reads bottom-to-top on the portrait page.
      this.doc.save();
      this.doc.translate(0, PAGE.height);
      this.doc.rotate(-90);
      this.frame = { ...ROTATED };
    } else this.frame = { ...PAGE };
  }

  /** Ends the turned drawing before the footers go on. */
  close(): void {
    if (this.rotated) this.doc.restore();
    this.rotated = false;
  }

  /** A bold heading at x (the current column); returns the y below it. */
  /** A bold heading; wrapped within `width` when given and it would run past it (off the column or page). */
  heading(str: string, x: number, y: number, size = 10, width?: number): number {
    if (width !== undefined && this.width(str, { size, bold: true }) > width) return this.sheet.paragraph(str, x, y, width, { size, bold: true }) + 4;
    this.sheet.text(str, x, y, { size, bold: true });
    return y + size + 8;
  }

  width(str: string, o: TextOptions = {}): number {
    return this.sheet.widthOf(str, o);
  }

  /** One line of text placed per line, per word or per glyph; never wrapped. */
  put(str: string, x: number, y: number, o: TextOptions = {}): void {
    if (str === '') return;
    let left = x;
    if (o.align && o.align !== 'left') {
      const w = this.width(str, o);
      left = o.align === 'right' ? x + (o.width ?? 0) - w : x + ((o.width ?? 0) - w) / 2;
    }
    const plain = { ...o, align: 'left' as const, width: undefined };
    if (this.c.placement === 'line') {
      this.sheet.text(str, left, y, plain);
      return;
    }
    const pieces = this.c.placement === 'word' ? str.split(/(?<= )/) : [...str];
    let cx = left;
    for (const piece of pieces) {
      const trimmed = piece.trimEnd();
      if (trimmed) this.sheet.text(trimmed, cx, y, plain);
      cx += this.width(piece, plain);
    }
  }

  /** Wrapped prose (always per line); returns the y below it. */
  prose(str: string, x: number, y: number, width: number, size = 8.5): number {
    return this.sheet.paragraph(str, x, y, width, { size });
  }

  rule(x1: number, x2: number, y: number, weight = 0.5): void {
    this.sheet.rule(x1, x2, y, weight);
  }

  vline(x: number, y1: number, y2: number): void {
    this.doc.moveTo(x, y1).lineTo(x, y2).lineWidth(0.4).strokeColor('#777777').stroke();
  }

  /** Records a printed value of a part (and of the parts sharing its printed row). */
  record(parts: PartModel[], field: Field, page = this.page): void {
    for (const p of parts) {
      const v = p.values[field];
      if (!v) continue;
      this.entry(p).fields[field] = { ...v, value: this.num(v.value), page };
    }
  }

  /** Records a device-wide value printed once for these parts. */
  recordDevice(parts: PartModel[], field: 'pdMax' | 'tjMax' | 'rthJA', v: Val, page = this.page): void {
    for (const p of parts) this.entry(p).fields[field] = { ...v, value: this.num(v.value), page };
  }

  /** Values derived from the tolerance legend carry the legend's page. */
  recordDerived(parts: PartModel[], page = this.page): void {
    for (const p of parts) for (const f of ['vzMin', 'vzMax'] as const) if (p.values[f]?.derived) this.entry(p).fields[f] = { ...p.values[f]!, page };
  }

  recordPackage(parts: PartModel[], page = this.page): void {
    for (const p of parts) {
      const e = this.entry(p);
      if (e.package.page === 0) e.package = { value: p.pkg.name, page };
    }
  }

  private entry(p: PartModel) {
    let e = this.answers.get(p.mpn);
    if (!e) {
      e = { package: { value: p.pkg.name, page: 0 }, fields: {} };
      this.answers.set(p.mpn, e);
    }
    return e;
  }
}

export interface GridColumn {
  width: number;
  align: 'left' | 'right' | 'center';
}

/** A table: header lines of spans, then rows of cells; ruled or not. Returns the y below it. */
export function grid(
  pen: Pen,
  x: number,
  y: number,
  columns: GridColumn[],
  header: HeaderSpan[][],
  rows: string[][],
  o: { size?: number; rowHeight?: number; onRow?: (index: number, page: number) => void; fit?: boolean } = {},
): number {
  let size = o.size ?? 7.5;
  if (o.fit) ({ columns, size } = fitColumns(pen, columns, header, rows, size));
  const rowHeight = o.rowHeight ?? 12;
  const lefts = [x];
  for (const col of columns) lefts.push(lefts[lefts.length - 1] + col.width);
  const right = lefts[columns.length];
  const top = y;
  pen.rule(x, right, y - 3, 0.8);
  let cy = y;
  for (const line of header) {
    for (const span of line) {
      const left = lefts[span.from];
      pen.put(span.text, left, cy, { size, bold: true, condensed: true, align: 'center', width: lefts[span.to + 1] - left });
    }
    cy += 10;
  }
  if (header.length) pen.rule(x, right, cy - 2, 0.5);
  if (header.length) cy += 2;
  rows.forEach((cells, r) => {
    columns.forEach((col, i) => {
      const pad = col.align === 'left' ? 2 : col.align === 'right' ? -3 : 0;
      pen.put(cells[i] ?? '', lefts[i] + pad, cy, { size, condensed: true, align: col.align, width: col.width });
    });
    o.onRow?.(r, pen.page);
    cy += rowHeight;
    if (pen.c.ruled && r < rows.length - 1) pen.rule(x, right, cy - 3, 0.3);
  });
  pen.rule(x, right, cy - 2, 0.8);
  if (pen.c.ruled) for (const l of lefts) pen.vline(l, top - 3, cy - 2);
  return cy + 6;
}

/**
 * Widths from what the columns hold, in the same total width, and a smaller type where even
 * that is too narrow: a printed table never runs one cell into the next.
 */
function fitColumns(pen: Pen, columns: GridColumn[], header: HeaderSpan[][], rows: string[][], size: number): { columns: GridColumn[]; size: number } {
  const total = columns.reduce((n, c) => n + c.width, 0);
  const need = (sz: number) =>
    columns.map((_, i) => {
      const cells = rows.map((r) => pen.width(r[i] ?? '', { size: sz, condensed: true }));
      const heads = header.flatMap((line) =>
        line.filter((h) => h.from === i && h.to === i).map((h) => pen.width(h.text, { size: sz, condensed: true, bold: true })),
      );
      return Math.max(8, ...cells, ...heads) + 6;
    });
  let widths = need(size);
  let sum = widths.reduce((n, x) => n + x, 0);
  while (sum > total && size > 4.6) {
    size = Math.max(4.5, size * 0.92);
    widths = need(size);
    sum = widths.reduce((n, x) => n + x, 0);
  }
  const scale = total / sum;
  return { columns: columns.map((c, i) => ({ ...c, width: widths[i] * scale })), size };
}

/** Blocks flowing down one or two columns and on to new pages. */
export class Flow {
  private col = 0;
  y: number;

  constructor(
    private readonly pen: Pen,
    private readonly columns: 1 | 2,
    start?: number,
  ) {
    this.y = start ?? pen.frame.top;
  }

  get width(): number {
    const f = this.pen.frame;
    return this.columns === 1 ? f.right - f.left : (f.right - f.left - 20) / 2;
  }

  get x(): number {
    const f = this.pen.frame;
    return this.col === 0 ? f.left : f.left + this.width + 20;
  }

  /** Room for a block of this height: next column or next page when it does not fit. */
  need(height: number, rotated = false): void {
    if (this.y + height <= this.pen.frame.bottom) return;
    if (this.columns === 2 && this.col === 0) {
      this.col = 1;
      this.y = this.topOfColumn;
      return;
    }
    this.pen.newPage(rotated);
    this.col = 0;
    this.y = this.pen.frame.top;
    this.topOfColumn = this.y;
  }

  topOfColumn = 0;

  startColumns(): void {
    this.topOfColumn = this.y;
  }

  /**
   * Below a block drawn across the whole frame (a series table): the columns start again
   * under it, so that nothing is later drawn over it in the right-hand column.
   */
  belowFullWidth(y: number): void {
    this.col = 0;
    this.y = y;
    this.topOfColumn = y;
  }

  /** Moves to the right-hand column (two-column pages), else stays. */
  nextColumn(): void {
    if (this.columns === 2 && this.col === 0) {
      this.col = 1;
      this.y = this.topOfColumn;
    }
  }

  newPage(rotated = false): void {
    this.pen.newPage(rotated);
    this.col = 0;
    this.y = this.pen.frame.top;
    this.topOfColumn = this.y;
  }
}
