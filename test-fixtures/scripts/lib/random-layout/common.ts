import { fixed } from '../numbers';
import { Prng } from '../prng';
import { Field } from '../types';
import { LayoutChoices, VocabKey } from './choices';

type LayoutClutter = LayoutChoices['clutter'][number];
import { DatasheetModel, PackageModel, PartModel, SeriesModel, Val } from './model';
import { Flow, grid, Pen } from './pen';

/** Pieces every random layout shares: conditions, footnote markers, ratings, legend, clutter. */

export interface Ctx {
  pen: Pen;
  prng: Prng;
  model: DatasheetModel;
  /** Footnote marker style of this vendor. */
  marker: (n: number) => string;
}

const SUPER = '⁰¹²³⁴⁵⁶⁷⁸⁹';
export function markerStyle(prng: Prng): (n: number) => string {
  const style = prng.pick(['paren-super', 'super-paren', 'note', 'bracket'] as const);
  return (n) => (style === 'paren-super' ? `⁽${SUPER[n]}⁾` : style === 'super-paren' ? `${SUPER[n]})` : style === 'note' ? ` (Note ${n})` : ` [${n}]`);
}

/** A value with a footnote marker stuck to it when the vendor uses them (first row only). */
export function marked(ctx: Ctx, text: string, n: number, on: boolean): string {
  return ctx.pen.c.footnotes && on ? `${text}${ctx.marker(n)}` : text;
}

export const sym = (ctx: Ctx, k: VocabKey) => ctx.pen.c.vocabulary[k].symbol;
export const name = (ctx: Ctx, k: VocabKey) => ctx.pen.c.vocabulary[k].name;

/** Whether a test condition is printed as its own value (column, row or line) for this series. */
export function ownIzt(ctx: Ctx, s: SeriesModel): boolean {
  const c = ctx.pen.c.conditions;
  return c === 'column' || (!s.iztConst && c !== 'at-sign');
}
export function ownIzk(ctx: Ctx, s: SeriesModel): boolean {
  return s.hasIzk && ctx.pen.c.conditions === 'column';
}
export function ownVr(ctx: Ctx): boolean {
  return ctx.pen.c.conditions !== 'at-sign';
}

/** "IZT = 5 mA" for a series-wide test current. */
export function condText(ctx: Ctx, k: VocabKey, v: Val): string {
  return `${sym(ctx, k)} = ${ctx.pen.vu(v)}`;
}

/** The series-wide conditions a table title or header names ("IZT = 5 mA, IZK = 0.25 mA"). */
export function seriesConditions(ctx: Ctx, s: SeriesModel): string {
  const parts: string[] = [];
  if (s.iztConst) parts.push(condText(ctx, 'izt', s.iztConst));
  if (s.hasIzk && s.izkConst) parts.push(condText(ctx, 'izk', s.izkConst));
  return parts.join(', ');
}

/** Records the series-wide test currents a header or title prints. */
export function recordSeriesConditions(ctx: Ctx, s: SeriesModel, page: number): void {
  const all = s.rows.flat();
  if (s.iztConst) ctx.pen.record(all, 'izt', page);
  if (s.hasIzk) ctx.pen.record(all, 'izk', page);
}

export function unitOf(p: PartModel, f: Field): string {
  return p.values[f]?.unit ?? '';
}

/** Cover: title, description and features (prose with numbers that are not ratings). */
export function cover(ctx: Ctx, flow: Flow): void {
  const { pen, model } = ctx;
  const vzs = model.parts.map((p) => p.vz);
  const lo = pen.num(String(Math.min(...vzs)));
  const hi = pen.num(String(Math.max(...vzs)));
  pen.sheet.text(model.title, pen.frame.left, 58, { size: 17, bold: true });
  const kind = model.packages.map((p) => p.name).join(' / ');
  pen.sheet.text(`Voltage regulator diodes, ${lo} V to ${hi} V, ${kind}`, pen.frame.left, 82, { size: 10.5 });
  // A single package is named here for every part (its page in the answer key).
  if (model.packages.length === 1) pen.recordPackage(model.parts, pen.page);
  flow.y = 104;
  flow.startColumns();
  const w = flow.width;
  const tol = model.series.map((s) => (s.legend ? s.legend.map((l) => `±${l.pct} %`).join(' / ') : `±${s.tolerancePct} %`)).join(' and ');
  let y = pen.prose(
    `Silicon planar regulator diodes for reference, clamp and bias circuits. The range covers nominal voltages ` +
      `from ${lo} V to ${hi} V in the E24 steps with a tolerance of ${pen.num(tol)}. Parts below about 5 V break down by ` +
      `tunnelling and drift downwards with temperature; parts above about 6 V break down by avalanche and drift upwards.`,
    flow.x,
    flow.y,
    w,
  );
  y = pen.heading('Features', flow.x, y + 4, 10);
  for (const f of [
    `Nominal voltages ${lo} V to ${hi} V`,
    `Packages: ${kind}`,
    `Reflow soldering up to 260 °C for 10 s`,
    `Moisture sensitivity level 1, lead-free plating`,
    // Thousands separators and a date: numbers a decimal-comma reader must not take for values.
    pen.c.decimal === 'comma' ? 'Life test 1.000 h at 125 °C; issued 04.12.2026' : 'Life test 1,000 h at 125 °C; issued 2026-12-04',
  ]) {
    pen.sheet.text('•', flow.x + 2, y, { size: 8.5 });
    y = pen.prose(f, flow.x + 12, y, w - 12) - 2;
  }
  flow.y = y + 8;
}

interface RatingLine {
  label: string;
  symbol: string;
  cond: string;
  value: string;
  unit: string;
  field?: 'pdMax' | 'tjMax' | 'rthJA';
  val?: Val;
}

function ratingLines(ctx: Ctx, pkg: PackageModel, withMarker: boolean): RatingLine[] {
  const { pen, prng } = ctx;
  const c = pen.c;
  const range = prng.next() < 0.5;
  const minus = prng.pick(['−', '-']);
  const tjVal: Val = range ? { ...pkg.tj, value: `+${pkg.tj.value}` } : pkg.tj;
  const lines: RatingLine[] = [
    {
      label: name(ctx, 'pd'),
      symbol: sym(ctx, 'pd'),
      cond: prng.pick(['TA = 25 °C', 'Tamb ≤ 25 °C', 'at TA = 25 °C']),
      value: marked(ctx, pen.num(pkg.pd.value), 1, withMarker),
      unit: pkg.pd.unit,
      field: 'pdMax',
      val: pkg.pd,
    },
  ];
  if (c.derating) lines.push({ label: 'Derating above 25 °C', symbol: '', cond: 'linear', value: pen.num(pkg.derating.value), unit: 'mW/K' });
  lines.push(
    {
      label: name(ctx, 'tj'),
      symbol: sym(ctx, 'tj'),
      cond: '',
      value: range ? `${minus}${prng.pick(['55', '65'])} to +${pkg.tj.value}` : pkg.tj.value,
      unit: '°C',
      field: 'tjMax',
      val: tjVal,
    },
    { label: 'Storage temperature', symbol: 'Tstg', cond: '', value: `${minus}65 to +${pkg.tj.value}`, unit: '°C' },
    { label: name(ctx, 'rth'), symbol: sym(ctx, 'rth'), cond: 'on FR4, minimum pads', value: pkg.rth.value, unit: pkg.rth.unit, field: 'rthJA', val: pkg.rth },
    { label: 'Forward voltage', symbol: 'VF', cond: 'IF = 200 mA', value: pen.num('1.1'), unit: 'V' },
    { label: 'Peak forward surge current', symbol: 'IFSM', cond: 'tp = 8.3 ms', value: pen.num('2.5'), unit: 'A' },
  );
  return lines;
}

/** The maximum ratings for some parts, as a table, a leader list or sentences. Returns the y below. */
export function ratingsBlock(ctx: Ctx, flow: Flow, heading: string, pkg: PackageModel, parts: PartModel[]): void {
  const { pen } = ctx;
  const c = pen.c;
  const lines = ratingLines(ctx, pkg, true);
  const record = (page: number) => {
    for (const l of lines) if (l.field && l.val) pen.recordDevice(parts, l.field, l.val, page);
    // A heading that names the package tells which package these parts come in.
    if (heading.includes(pkg.name)) pen.recordPackage(parts, page);
  };
  const w = flow.width;
  if (c.ratingsForm === 'sentence') {
    flow.need(80);
    const y = pen.heading(heading, flow.x, flow.y, 10);
    const pd = lines[0];
    const tj = lines.find((l) => l.field === 'tjMax')!;
    const rth = lines.find((l) => l.field === 'rthJA')!;
    const der = c.derating ? ` and is derated by ${pen.num(pkg.derating.value)} mW/K above 25 °C` : '';
    const tjWords = tj.value.includes('to') ? `between ${tj.value.replace(' to ', ' °C and ')} °C` : `up to ${tj.value} °C`;
    const text =
      `The power dissipation ${pd.symbol} is ${pd.value} ${pd.unit} at an ambient of 25 °C${der}. ` +
      `The junction may operate ${tjWords}. The thermal resistance from junction to ambient ${rth.symbol} is ${rth.value} ${rth.unit} ` +
      `on an FR4 board with minimum pads; forward voltage is below ${pen.num('1.1')} V at 200 mA.`;
    flow.y = pen.prose(text, flow.x, y, w) + 6;
    record(pen.page);
    return;
  }
  if (c.ratingsForm === 'list') {
    flow.need(lines.length * 12 + 30);
    let y = pen.heading(heading, flow.x, flow.y, 10);
    for (const l of lines) {
      const label = `${l.label}${l.symbol ? `, ${l.symbol}` : ''}${l.cond ? ` (${l.cond})` : ''}`;
      leader(ctx, flow.x, y, w, label, `${l.value} ${l.unit}`);
      y += 12;
    }
    record(pen.page);
    flow.y = y + 6;
    return;
  }
  flow.need(lines.length * 12 + 40);
  const y = pen.heading(heading, flow.x, flow.y, 10);
  const eachValue = c.units === 'each-value';
  const narrow = w < 300;
  const cols = eachValue
    ? narrow
      ? [0.36, 0.12, 0.26, 0.26]
      : [0.4, 0.14, 0.28, 0.18]
    : narrow
      ? [0.33, 0.1, 0.23, 0.23, 0.11]
      : [0.36, 0.12, 0.26, 0.14, 0.12];
  const head = eachValue ? ['Parameter', 'Symbol', 'Conditions', 'Value'] : ['Parameter', 'Symbol', 'Conditions', 'Value', 'Unit'];
  const rows = lines.map((l) => (eachValue ? [l.label, l.symbol, l.cond, `${l.value} ${l.unit}`] : [l.label, l.symbol, l.cond, l.value, l.unit]));
  flow.y = grid(
    pen,
    flow.x,
    y,
    cols.map((f, i) => ({ width: f * w, align: i === 0 || i === 2 ? 'left' : 'center' })),
    [head.map((text, i) => ({ text, from: i, to: i }))],
    rows,
    { size: narrow ? 5.5 : 7.5 },
  );
  record(pen.page);
  if (c.footnotes) flow.y = pen.prose(`${ctx.marker(1).trim()} Device on an FR4 board of 40 mm × 40 mm × 1.6 mm.`, flow.x, flow.y, w, 7);
}

/** "Label ........ value": a leader line across the width. */
export function leader(ctx: Ctx, x: number, y: number, w: number, label: string, value: string, unit = ''): void {
  const { pen } = ctx;
  const unitW = unit ? 34 : 0;
  // A label too long for the line is set smaller, as a printed list would: the value never
  // runs over the label, nor the line past its column.
  let size = w < 300 ? 7.5 : 8.5;
  while (size > 5 && pen.width(label, { size }) + pen.width(value, { size }) + unitW + 12 > w) size -= 0.25;
  pen.put(label, x, y, { size });
  const lw = pen.width(label, { size });
  const vw = pen.width(value, { size });
  const dotsFrom = x + lw + 4;
  const dotsTo = x + w - unitW - vw - 4;
  if (dotsTo > dotsFrom) {
    const n = Math.floor((dotsTo - dotsFrom) / pen.width('.', { size }));
    pen.sheet.text('.'.repeat(Math.max(0, n)), dotsFrom, y, { size });
  }
  pen.put(value, x + w - unitW - vw, y, { size });
  if (unit) pen.put(unit, x + w - unitW + 4, y, { size });
}

/** The tolerance legend: min and max follow from the letter after the part number. */
export function legendBlock(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  if (!s.legend) return;
  const { pen } = ctx;
  flow.need(40);
  const letters = s.legend.map((l) => `${l.letter} ±${pen.num(String(l.pct))} %`).join(', ');
  const example = s.rows[0][0].mpn;
  flow.y = pen.prose(
    `Tolerance of ${sym(ctx, 'vz')}: the letter after the type number gives it (${letters}). Example: ${example} is the ` +
      `${pen.num(s.rows[0][0].values.vzNom!.value)} V type with ±${pen.num(String(s.legend[0].pct))} %.`,
    flow.x,
    flow.y,
    flow.width,
  );
  pen.recordDerived(s.rows.flat());
  flow.y += 4;
}

/** Ordering codes: base part number plus a packing suffix (not new parts). */
export function orderingBlock(ctx: Ctx, flow: Flow): void {
  const { pen, model, prng } = ctx;
  const parts = model.parts.slice(0, 6);
  flow.need(parts.length * 12 + 50);
  const y = pen.heading('Ordering information', flow.x, flow.y, 10);
  const packing = prng.pick([
    ['-T7', '3000', '7 in reel'],
    ['-TR', '10000', '13 in reel'],
    ['-BK', '1000', 'bulk bag'],
  ]);
  const qty = pen.c.decimal === 'comma' ? packing[1].replace(/(\d)(\d{3})$/, '$1.$2') : packing[1].replace(/(\d)(\d{3})$/, '$1,$2');
  const w = flow.width;
  flow.y = grid(
    pen,
    flow.x,
    y,
    [
      { width: w * 0.34, align: 'left' },
      { width: w * 0.2, align: 'center' },
      { width: w * 0.2, align: 'center' },
      { width: w * 0.26, align: 'left' },
    ],
    [['Ordering code', 'Package', 'Quantity', 'Packing'].map((text, i) => ({ text, from: i, to: i }))],
    parts.map((p) => [`${p.mpn}${packing[0]}`, p.pkg.name, qty, packing[2]]),
  );
  const date = pen.c.decimal === 'comma' ? '04.12.2026' : '2026-12-04';
  flow.y = pen.prose(`Ordering codes add the packing suffix to the type number. Document issued ${date}.`, flow.x, flow.y, w, 7.5) + 4;
}

/** Prose, curves, outline and a worked example: numbers that are not ratings. */
export function clutterBlocks(ctx: Ctx, flow: Flow, which: LayoutClutter[]): void {
  const { pen, model } = ctx;
  const c = { ...pen.c, clutter: pen.c.clutter.filter((x) => which.includes(x)) };
  const p = model.parts[Math.floor(model.parts.length / 2)];
  const w = flow.width;
  if (c.clutter.includes('prose')) {
    flow.need(70);
    flow.y = pen.heading('Application notes', flow.x, flow.y, 10);
    flow.y =
      pen.prose(
        `A regulator diode holds its voltage within a few percent from about ${pen.num('0.5')} mA to the limit set by power. ` +
          `At 40 °C ambient a ${pen.num('0.5')} W part can take about ${pen.num('0.45')} W; at 100 °C about half. ` +
          `Keep the series resistor sized for the lowest supply (e.g. 10 V) and the highest load (e.g. 20 mA).`,
        flow.x,
        flow.y,
        w,
      ) + 6;
  }
  if (c.clutter.includes('example')) {
    flow.need(80);
    flow.y = pen.heading('Design example', flow.x, flow.y, 10);
    const vz = p.values.vzNom!;
    const vin = Math.ceil(vz.si * 1.6 + 2);
    const iz = 10;
    const r = Math.round((vin - vz.si) / ((iz + 5) * 1e-3) / 10) * 10;
    const pw = Math.round(vz.si * (iz + 5));
    flow.y =
      pen.prose(
        `Supply ${vin} V, load 5 mA, ${p.mpn} at ${iz} mA: R = (${vin} V − ${pen.num(vz.value)} V) / ${iz + 5} mA ≈ ${r} ${c.ohm}. ` +
          `The diode dissipates ${pen.num(vz.value)} V × ${iz + 5} mA = ${pw} mW with no load, well inside its rating. ` +
          `Its voltage moves by about ${pen.num(fixed(Math.abs(p.values.tc?.si ?? 0.002) * 1000 * 50, 1))} mV over 50 K.`,
        flow.x,
        flow.y,
        w,
      ) + 6;
  }
  if (c.clutter.includes('curves')) {
    flow.need(150);
    const y = pen.heading('Typical characteristics', flow.x, flow.y, 10);
    const x0 = flow.x + 30;
    const gw = Math.min(200, w - 40);
    pen.doc
      .rect(x0, y + 4, gw, 100)
      .lineWidth(0.5)
      .strokeColor('#555555')
      .stroke();
    for (let i = 0; i <= 4; i++) {
      pen.sheet.text(String(i * 5), x0 + (gw * i) / 4 - 4, y + 108, { size: 6.5 });
      pen.sheet.text(pen.num(String(i * 2.5)), x0 - 22, y + 100 - i * 25, { size: 6.5 });
    }
    pen.doc
      .moveTo(x0, y + 104)
      .bezierCurveTo(x0 + 20, y + 20, x0 + 60, y + 12, x0 + gw, y + 8)
      .stroke();
    pen.sheet.text(`Fig. 1 ${sym(ctx, 'izt')} (mA) against ${sym(ctx, 'vz')} (V), TA = 25 °C`, x0, y + 118, { size: 7 });
    flow.y = y + 134;
  }
  if (c.clutter.includes('outline')) {
    flow.need(110);
    const y = pen.heading(`Package outline ${p.pkg.name} (mm)`, flow.x, flow.y, 10);
    flow.y = grid(
      pen,
      flow.x,
      y,
      [
        { width: 40, align: 'left' },
        { width: 50, align: 'center' },
        { width: 50, align: 'center' },
      ],
      [['Dim.', 'Min', 'Max'].map((text, i) => ({ text, from: i, to: i }))],
      [
        ['A', '0.95', '1.35'],
        ['b', '0.45', '0.65'],
        ['D', '1.40', '1.80'],
        ['E', '2.55', '2.85'],
      ].map((r) => r.map((x) => pen.num(x))),
    );
  }
}

/** Groups parts by package, for per-package ratings. */
export function byPackage(model: DatasheetModel): Array<[PackageModel, PartModel[]]> {
  return model.packages.map((pkg) => [pkg, model.parts.filter((p) => p.pkg === pkg)]);
}

export const allParts = (s: SeriesModel) => s.rows.flat();
