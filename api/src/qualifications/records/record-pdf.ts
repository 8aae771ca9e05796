import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  CARD_FIELD_KINDS,
  CARD_FIELDS,
  QUALIFICATION_VERDICT_LABELS,
  formatMargin,
  formatNumber,
  formatQuantity,
  formatTc,
  type CardValue,
  type CheckQuantity,
  type QualificationVerdict,
  type TcValue,
} from '@shuntwise/contracts';
import PDFDocument from 'pdfkit';
import { canonicalJson, sha256Hex, type RecordInputs } from './record-inputs';

/**
 * DejaVu Sans (Debian `fonts-dejavu-core`, installed by `npm start`/`npm test` when missing)
 * carries µ, Ω, °, − and ≤, which the PDF base fonts cannot. The same font file gives the
 * same bytes: a machine with another DejaVu release re-draws a record differently, which the
 * re-render check then reports instead of replacing the stored record.
 */
export const RECORD_FONT_DIR = '/usr/share/fonts/truetype/dejavu';
const FONT_FILES = { regular: 'DejaVuSans.ttf', bold: 'DejaVuSans-Bold.ttf' } as const;

let fontCache: { regular: Buffer; bold: Buffer } | null = null;
function fonts(): { regular: Buffer; bold: Buffer } {
  if (fontCache) return fontCache;
  const missing = Object.values(FONT_FILES).filter((f) => !existsSync(join(RECORD_FONT_DIR, f)));
  if (missing.length) throw new Error(`decision records need ${missing.join(', ')} in ${RECORD_FONT_DIR} (Debian package fonts-dejavu-core)`);
  fontCache = { regular: readFileSync(join(RECORD_FONT_DIR, FONT_FILES.regular)), bold: readFileSync(join(RECORD_FONT_DIR, FONT_FILES.bold)) };
  return fontCache;
}

const MARGIN = 50;
const VERDICT_COLOURS: Record<QualificationVerdict, string> = { pass: '#1b6e3a', marginal: '#8a5a00', fail: '#a4161a', 'no-data': '#555555' };

/**
 * Draws the decision record from its frozen inputs. Deterministic: the dates inside the PDF
 * (CreationDate, ModDate and the file ID pdfkit derives from them) are the record's own
 * `madeAt`, fonts are subset under fixed tags, and nothing random or clock-dependent is
 * written, so the same inputs give the same bytes.
 */
export async function renderDecisionRecord(inputs: RecordInputs): Promise<Buffer> {
  const inputsSha256 = sha256Hex(canonicalJson(inputs));
  const madeAt = new Date(inputs.madeAt);
  const c = inputs.case;
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    bufferPages: false,
    info: {
      Title: `Decision record, case #${c.id}: ${inputs.vendorPart.manufacturer} ${inputs.vendorPart.mpn} for ${inputs.housePart.partNumber}`,
      Author: 'Shuntwise',
      Subject: `Qualification case #${c.id}, ${c.decision?.stateLabel ?? c.stateLabel}`,
      Creator: 'Shuntwise',
      Producer: 'Shuntwise',
      CreationDate: madeAt,
      ModDate: madeAt,
    },
  });
  const f = fonts();
  doc.registerFont('regular', f.regular);
  doc.registerFont('bold', f.bold);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<void>((resolve, reject) => {
    doc.on('end', resolve);
    doc.on('error', reject);
  });

  const pen = new Pen(doc);
  pen.title(`Decision record — qualification case #${c.id} (revision ${c.revision})`);
  pen.text(`${inputs.vendorPart.manufacturer} ${inputs.vendorPart.mpn} as a source of ${inputs.housePart.partNumber} (${inputs.housePart.description})`, {
    bold: true,
  });
  pen.text(
    `Decision: ${c.decision ? `${c.decision.stateLabel} by ${c.decision.by.name} on ${stamp(c.decision.at)}` : `${c.stateLabel} (no decision recorded)`}`,
    { bold: true, size: 11 },
  );
  if (c.decision?.text)
    pen.text(`${c.decision.state === 'rejected' ? 'Reason' : c.decision.state === 'cleared-with-conditions' ? 'Conditions' : 'Note'}: ${c.decision.text}`);
  pen.text(
    `Prepared by ${c.preparedBy.name}${c.reviewer ? `; review asked of ${c.reviewer.name}` : ''}. Opened ${stamp(c.openedAt)}${c.submittedAt ? `, sent for review ${stamp(c.submittedAt)}` : ''}.`,
  );
  if (c.revocation) pen.text(`Revoked by ${c.revocation.by.name} on ${stamp(c.revocation.at)}: ${c.revocation.reason}`);
  pen.text(`Evaluation: ${QUALIFICATION_VERDICT_LABELS[inputs.evaluation.overall]} — ${inputs.evaluation.summary}.`);
  pen.text(`Record made ${stamp(inputs.madeAt)}. Inputs sha256: ${inputsSha256}`, { size: 8 });
  pen.gap();

  pen.heading(`House part ${inputs.housePart.partNumber}, spec version ${inputs.housePart.specVersion}`);
  const spec = inputs.housePart.spec;
  if (!spec) pen.text('The spec version could not be read.');
  else {
    const v = (x: number | null | undefined, kind: Parameters<typeof formatQuantity>[1]) => formatQuantity(x ?? null, kind);
    pen.table(
      [
        ['Reference current iRef', v(spec.iRef, 'current')],
        ['Zener voltage window at iRef', `${v(spec.vz.min, 'voltage')} … ${v(spec.vz.nom, 'voltage')} … ${v(spec.vz.max, 'voltage')}`],
        ['Largest dynamic impedance', spec.zdMax === null ? 'not limited' : v(spec.zdMax, 'resistance')],
        [
          'Knee',
          spec.knee
            ? [
                spec.knee.maxRatio !== null ? `Zd(${v(spec.knee.iKnee, 'current')})/Zd(iRef) ≤ ${spec.knee.maxRatio}` : '',
                spec.knee.maxSpan !== null ? `span ≤ ${v(spec.knee.maxSpan, 'voltage')}` : '',
              ]
                .filter(Boolean)
                .join('; ')
            : 'not limited',
        ],
        ['Leakage', spec.leakage ? `≤ ${v(spec.leakage.irMax, 'current')} at ${v(spec.leakage.vr, 'voltage')}` : 'not limited'],
        ['Temperature coefficient', spec.tc ? `${v(spec.tc.min, 'tempCoVoltage')} … ${v(spec.tc.max, 'tempCoVoltage')}` : 'not limited'],
        [
          'Power',
          spec.power
            ? `rating ≥ ${v(spec.power.pdMin, 'power')}, at most ${Math.round(spec.power.deratingFraction * 100)} % of the derated power`
            : 'not limited',
        ],
        ['Packages', spec.packages.length ? spec.packages.join(', ') : 'any'],
        [
          'Envelope',
          `${v(spec.envelope.iMin, 'current')} … ${v(spec.envelope.iMax, 'current')}, ${v(spec.envelope.taMin, 'temperature')} … ${v(spec.envelope.taMax, 'temperature')}`,
        ],
        ['Output window', spec.outputWindow ? `${v(spec.outputWindow.vMin, 'voltage')} … ${v(spec.outputWindow.vMax, 'voltage')}` : 'none'],
        ['Marginal band', `${spec.marginalBandPercent} %`],
      ],
      [190, 305],
    );
  }
  pen.gap();

  const vp = inputs.vendorPart;
  pen.heading(`Vendor part ${vp.manufacturer} ${vp.mpn}${vp.package ? ` (${vp.package})` : ''}, rating card version ${vp.cardVersion}`);
  const sheets = new Map(inputs.datasheets.map((d) => [d.id, d]));
  const cardRows: string[][] = [['Rating', 'Value', 'As printed', 'Provenance']];
  for (const field of CARD_FIELDS) {
    const value = vp.card?.[field] as CardValue | TcValue | undefined;
    if (!value) continue;
    const shown = field === 'tc' ? formatTc(value as TcValue) : formatQuantity(value.value, CARD_FIELD_KINDS[field]);
    const p = value.provenance;
    const sheet = p.datasheetId !== null ? sheets.get(p.datasheetId) : undefined;
    const where = [
      p.source,
      p.datasheetId !== null ? `datasheet #${p.datasheetId}${sheet ? ` ${sheet.fileName}${sheet.revision ? ` rev. ${sheet.revision}` : ''}` : ''}` : '',
      p.page !== null ? `page ${p.page}` : '',
      p.text ? `“${p.text}”` : '',
      p.confirmedBy ? `confirmed by ${p.confirmedBy.name}` : '',
    ]
      .filter(Boolean)
      .join(', ');
    cardRows.push([field, shown, value.printed ?? '', where]);
  }
  if (cardRows.length === 1) pen.text('The card version could not be read.');
  else pen.table(cardRows, [50, 75, 75, 295], true);
  if (vp.cardNote) pen.text(`Card note: ${vp.cardNote}`);
  if (inputs.datasheets.length) {
    pen.text('Datasheets cited:', { bold: true });
    for (const d of inputs.datasheets)
      pen.text(`#${d.id} ${d.fileName}${d.revision ? ` rev. ${d.revision}` : ''}, ${d.pages} page(s), sha256 ${d.sha256}`, { size: 8 });
  }
  pen.gap();

  pen.heading(`Checks against spec version ${inputs.evaluation.specVersion} (card version ${inputs.evaluation.cardVersion})`);
  const checkRows: string[][] = [['Check', 'Normalised value', 'Limit', 'Margin', 'Verdict']];
  for (const check of inputs.evaluation.checks) {
    const value =
      check.quantity === 'text'
        ? (check.text?.value ?? '–')
        : check.range
          ? `${fmt(check.range.low, check.quantity)} … ${fmt(check.range.high, check.quantity)}`
          : fmt(check.value, check.quantity);
    const limit =
      check.quantity === 'text'
        ? check.text?.allowed.length
          ? `one of ${check.text.allowed.join(', ')}`
          : 'any'
        : check.window
          ? `${fmt(check.window.min, check.quantity)} … ${fmt(check.window.max, check.quantity)}`
          : `${check.limitKind === 'max' ? '≤ ' : check.limitKind === 'min' ? '≥ ' : ''}${fmt(check.limit, check.quantity)}`;
    checkRows.push([check.label, value, limit, formatMargin(check.margin), QUALIFICATION_VERDICT_LABELS[check.verdict]]);
  }
  pen.table(checkRows, [165, 110, 110, 50, 60], true, (row) => (row === 0 ? null : VERDICT_COLOURS[inputs.evaluation.checks[row - 1].verdict]));
  for (const check of inputs.evaluation.checks) pen.text(`${check.label}: ${check.detail}`, { size: 8 });
  for (const skipped of inputs.evaluation.notApplicable) pen.text(`Not checked — ${skipped.label}: ${skipped.reason}`, { size: 8 });
  for (const a of inputs.evaluation.assumptions) pen.text(`Assumed: ${a}`, { size: 8 });
  for (const w of inputs.evaluation.warnings) pen.text(`Warning: ${w}`, { size: 8 });
  pen.gap();

  pen.heading('I–V curve of the card at 25 °C');
  if (inputs.curve) pen.chart(inputs.curve);
  if (inputs.curveNote) pen.text(inputs.curveNote, { size: 8 });
  pen.gap();

  pen.heading('Measurement sets');
  if (inputs.measurementSets.length === 0) pen.text('No measurement set of this part when the record was made.');
  for (const set of inputs.measurementSets) {
    pen.text(
      `Set #${set.id}: ${set.fileName}, ${set.samples} sample(s), ${set.points} point(s)${set.lot ? `, lot ${set.lot}` : ''}${set.instrument ? `, ${set.instrument}` : ''}${set.measuredOn ? `, measured ${set.measuredOn}` : ''}; overall ${QUALIFICATION_VERDICT_LABELS[set.analysis.overall]}`,
      { bold: true },
    );
    pen.text(
      `sha256 ${set.sha256}, ${set.sizeBytes} bytes, uploaded ${stamp(set.uploadedAt)}; analysed against card version ${set.analysis.cardVersion ?? '–'} and spec version ${set.analysis.specVersion ?? '–'}`,
      { size: 8 },
    );
    const rows: string[][] = [['Measured check', 'Value', 'Limit', 'Margin', 'Verdict']];
    for (const m of set.analysis.checks) {
      rows.push([
        m.label,
        fmt(m.value, m.quantity),
        m.window ? `${fmt(m.window.min, m.quantity)} … ${fmt(m.window.max, m.quantity)}` : fmt(m.limit, m.quantity),
        formatMargin(m.margin),
        QUALIFICATION_VERDICT_LABELS[m.verdict],
      ]);
    }
    if (rows.length > 1) pen.table(rows, [215, 80, 90, 50, 60], true, (row) => (row === 0 ? null : VERDICT_COLOURS[set.analysis.checks[row - 1].verdict]));
  }
  pen.gap();

  pen.heading('Comments');
  if (inputs.comments.length === 0) pen.text('None.');
  for (const comment of inputs.comments) pen.text(`${stamp(comment.at)}, ${comment.by}: ${comment.text}`);
  pen.gap();

  pen.heading('Audit trail');
  for (const e of inputs.audit) {
    const changes = e.changes.map((ch) => `${ch.field} ${String(ch.from)} → ${String(ch.to)}`).join('; ');
    pen.text(
      `${stamp(e.at)} ${e.by ?? 'system'}: ${e.action}${e.toState ? ` (${e.fromState ?? '–'} → ${e.toState})` : ''}${e.note ? ` — ${e.note}` : ''}${changes ? ` [${changes}]` : ''}`,
      { size: 8 },
    );
  }
  pen.gap();

  pen.heading('Caution');
  pen.text(inputs.caution);
  pen.text(
    "The values above are the case as it stood when it was decided; the organisation's qualification procedure and the relevant standards govern its use.",
  );
  pen.gap();
  pen.text(`Inputs sha256 (canonical JSON of the case snapshot): ${inputsSha256}`, { size: 8, bold: true });

  doc.end();
  await done;
  return Buffer.concat(chunks);
}

function fmt(value: number | null, quantity: CheckQuantity): string {
  if (value === null) return '–';
  if (quantity === 'ratio') return formatNumber(value);
  if (quantity === 'text') return String(value);
  return formatQuantity(value, quantity);
}

/** ISO time to the second, UTC, as the record prints it. */
function stamp(iso: string): string {
  return `${iso.slice(0, 19).replace('T', ' ')} UTC`;
}

/** Text, tables and the chart, flowing down the page and onto new pages. */
class Pen {
  private readonly width: number;
  private readonly bottom: number;

  constructor(private readonly doc: PDFKit.PDFDocument) {
    this.width = doc.page.width - 2 * MARGIN;
    this.bottom = doc.page.height - MARGIN;
  }

  title(text: string): void {
    this.doc.font('bold').fontSize(15).fillColor('#000000').text(text, MARGIN, this.doc.y, { width: this.width });
    this.doc.moveDown(0.3);
  }

  heading(text: string): void {
    this.room(40);
    this.doc.font('bold').fontSize(12).fillColor('#1d3557').text(text, MARGIN, this.doc.y, { width: this.width });
    this.doc.moveDown(0.2);
  }

  text(text: string, o: { bold?: boolean; size?: number } = {}): void {
    this.doc
      .font(o.bold ? 'bold' : 'regular')
      .fontSize(o.size ?? 9.5)
      .fillColor('#000000')
      .text(text, MARGIN, this.doc.y, { width: this.width });
  }

  gap(): void {
    this.doc.moveDown(0.6);
  }

  /** Rows of cells in fixed columns; a row that does not fit starts a new page. */
  table(rows: string[][], widths: number[], header = false, colourOf?: (row: number) => string | null): void {
    const doc = this.doc;
    rows.forEach((cells, r) => {
      const bold = header && r === 0;
      doc.font(bold ? 'bold' : 'regular').fontSize(8.5);
      const height = Math.max(...cells.map((cell, i) => doc.heightOfString(cell || ' ', { width: widths[i] - 4 }))) + 3;
      this.room(height);
      const y = doc.y;
      let x = MARGIN;
      cells.forEach((cell, i) => {
        const colour = i === cells.length - 1 && colourOf ? colourOf(r) : null;
        doc.fillColor(colour ?? '#000000').text(cell, x, y, { width: widths[i] - 4, lineBreak: true });
        x += widths[i];
      });
      doc
        .moveTo(MARGIN, y + height - 1)
        .lineTo(MARGIN + widths.reduce((a, b) => a + b, 0), y + height - 1)
        .lineWidth(0.3)
        .strokeColor('#bbbbbb')
        .stroke();
      doc.x = MARGIN;
      doc.y = y + height;
    });
    doc.fillColor('#000000');
  }

  /** The curve on a log-current axis with vector lines: tolerance ends dashed, nominal solid, the spec window at iRef. */
  chart(curve: NonNullable<RecordInputs['curve']>): void {
    const doc = this.doc;
    const w = this.width - 50;
    const h = 210;
    this.room(h + 40);
    const left = MARGIN + 45;
    const top = doc.y + 5;
    const points = curve.points;
    const xs = points.map((p) => Math.log10(p.current));
    const x0 = Math.floor(Math.min(...xs));
    const x1 = Math.ceil(Math.max(...xs));
    const vs = points.flatMap((p) => [p.low, p.high]).concat(curve.window ? [curve.window.min, curve.window.max] : []);
    const vMin = Math.min(...vs);
    const vMax = Math.max(...vs);
    const pad = (vMax - vMin) * 0.08 || 0.1;
    const y0 = vMin - pad;
    const y1 = vMax + pad;
    const X = (current: number) => left + ((Math.log10(current) - x0) / (x1 - x0)) * w;
    const Y = (v: number) => top + h - ((v - y0) / (y1 - y0)) * h;

    doc.lineWidth(0.5).strokeColor('#000000').rect(left, top, w, h).stroke();
    doc.font('regular').fontSize(7).fillColor('#000000');
    for (let d = x0; d <= x1; d++) {
      const x = left + ((d - x0) / (x1 - x0)) * w;
      doc
        .moveTo(x, top)
        .lineTo(x, top + h)
        .lineWidth(0.2)
        .strokeColor('#cccccc')
        .stroke();
      doc.text(formatQuantity(10 ** d, 'current'), x - 20, top + h + 3, { width: 40, align: 'center', lineBreak: false });
    }
    // Round voltages on the axis: a 1-2-5 step giving about five lines.
    const raw = (y1 - y0) / 5;
    const decade = 10 ** Math.floor(Math.log10(raw));
    const step = [1, 2, 5, 10].map((m) => m * decade).find((s) => s >= raw)!;
    for (let k = Math.ceil(y0 / step); k * step <= y1; k++) {
      const v = k * step;
      const y = Y(v);
      doc
        .moveTo(left, y)
        .lineTo(left + w, y)
        .lineWidth(0.2)
        .strokeColor('#cccccc')
        .stroke();
      doc.text(formatQuantity(v, 'voltage', { digits: 4 }), MARGIN - 5, y - 3, { width: 48, align: 'right', lineBreak: false });
    }
    const line = (key: 'low' | 'nom' | 'high', colour: string, dash: boolean) => {
      points.forEach((p, i) => (i === 0 ? doc.moveTo(X(p.current), Y(p[key])) : doc.lineTo(X(p.current), Y(p[key]))));
      if (dash) doc.dash(3, { space: 2 });
      doc
        .lineWidth(dash ? 0.8 : 1.4)
        .strokeColor(colour)
        .stroke();
      doc.undash();
    };
    line('low', '#457b9d', true);
    line('high', '#457b9d', true);
    line('nom', '#1d3557', false);
    if (curve.window && curve.iRef !== null) {
      const x = X(curve.iRef);
      doc.moveTo(x, Y(curve.window.min)).lineTo(x, Y(curve.window.max)).lineWidth(2).strokeColor('#e63946').stroke();
      for (const v of [curve.window.min, curve.window.max])
        doc
          .moveTo(x - 4, Y(v))
          .lineTo(x + 4, Y(v))
          .lineWidth(1)
          .strokeColor('#e63946')
          .stroke();
    }
    doc.fillColor('#000000').font('regular').fontSize(7.5);
    doc.text('reverse current (log scale)', left, top + h + 13, { width: w, align: 'center' });
    doc.text(
      `Solid: nominal; dashed: the card's tolerance ends; red bar: the spec's window at iRef${curve.iRef !== null ? ` (${formatQuantity(curve.iRef, 'current')})` : ''}. Junction at ${curve.tempC} °C, from the breakdown model fitted to the card.`,
      MARGIN,
      doc.y + 2,
      { width: this.width },
    );
    doc.x = MARGIN;
  }

  /** Starts a new page when less than `height` is left. */
  private room(height: number): void {
    if (this.doc.y + height > this.bottom) {
      this.doc.addPage();
      this.doc.y = MARGIN;
    }
  }
}
