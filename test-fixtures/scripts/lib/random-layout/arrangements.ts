import { HeaderSpan } from '../sheet';
import { Field } from '../types';
import { bracketed, qualifierWord, VocabKey } from './choices';
import { Ctx, condText, leader, marked, name, ownIzk, ownIzt, ownVr, recordSeriesConditions, seriesConditions, sym } from './common';
import { PartModel, SeriesModel } from './model';
import { Flow, grid, GridColumn } from './pen';

/**
 * The per-part characteristics in six arrangements. Each arrangement builds on one list of
 * printed quantities (ParamSpec), so that the same choice of units, conditions, decimal
 * sign and footnotes reads the same way in a table, a list or a sentence.
 */

export interface ParamSpec {
  key: VocabKey;
  qual: '' | 'min' | 'nom' | 'typ' | 'max';
  field: Field;
  /** The test condition this quantity is measured at. */
  cond?: { key: VocabKey; field: Field };
  /** A column/row/line that prints the condition itself. */
  ownCondition?: boolean;
  /** Whether the package column (parts need it to join per-package ratings). */
  isPackage?: boolean;
}

export function paramSpecs(ctx: Ctx, s: SeriesModel): ParamSpec[] {
  const izt = { key: 'izt' as const, field: 'izt' as const };
  const out: ParamSpec[] = [];
  if (!s.legend) out.push({ key: 'vz', qual: 'min', field: 'vzMin', cond: izt });
  out.push({ key: 'vz', qual: 'nom', field: 'vzNom', cond: izt });
  if (!s.legend) out.push({ key: 'vz', qual: 'max', field: 'vzMax', cond: izt });
  if (ownIzt(ctx, s)) out.push({ key: 'izt', qual: '', field: 'izt', ownCondition: true });
  out.push({ key: 'zzt', qual: 'max', field: 'zzt', cond: izt });
  if (s.hasIzk) {
    if (ownIzk(ctx, s)) out.push({ key: 'izk', qual: '', field: 'izk', ownCondition: true });
    out.push({ key: 'zzk', qual: 'max', field: 'zzk', cond: { key: 'izk', field: 'izk' } });
  }
  out.push({ key: 'ir', qual: 'max', field: 'irMax', cond: { key: 'vr', field: 'vr' } });
  if (ownVr(ctx)) out.push({ key: 'vr', qual: '', field: 'vr', ownCondition: true });
  out.push({ key: 'tc', qual: 'typ', field: 'tc', cond: izt });
  if (s.hasIzm) out.push({ key: 'izm', qual: 'max', field: 'izm' });
  return out;
}

/** Whether the condition of a spec is attached to its value with "@". */
function atSign(ctx: Ctx, s: SeriesModel, spec: ParamSpec): boolean {
  if (ctx.pen.c.conditions !== 'at-sign' || !spec.cond) return false;
  if (spec.key === 'vz' && spec.qual !== 'nom') return false;
  if (spec.key === 'tc') return false;
  return !(spec.cond.key === 'izt' && ownIzt(ctx, s));
}

/** The printed cell of a quantity for a part; records what it prints unless page is 0. */
export function cell(ctx: Ctx, s: SeriesModel, spec: ParamSpec, row: PartModel[], first: boolean, unitInCell: boolean, page: number): string {
  const { pen } = ctx;
  const p = row[0];
  const v = p.values[spec.field];
  if (!v) return '–';
  if (page) pen.record(row, spec.field, page);
  let text = marked(ctx, pen.num(v.value), 2, first && (spec.field === 'vzNom' || spec.field === 'tc'));
  if (unitInCell) text += ` ${v.unit}`;
  if (atSign(ctx, s, spec)) {
    const cv = p.values[spec.cond!.field]!;
    if (page) pen.record(row, spec.cond!.field, page);
    text += ` @ ${pen.vu(cv)}`;
  }
  return text;
}

/** The condition a header names ("at IZT = 5 mA"), when conditions stand in headers. */
function headerCondition(ctx: Ctx, s: SeriesModel, spec: ParamSpec): string {
  if (ctx.pen.c.conditions !== 'header' || !spec.cond) return '';
  if (spec.cond.key === 'izt' && s.iztConst) return ` at ${condText(ctx, 'izt', s.iztConst)}`;
  if (spec.cond.key === 'izk' && s.izkConst) return ` at ${condText(ctx, 'izk', s.izkConst)}`;
  if (spec.cond.key === 'vr') return ` at ${sym(ctx, 'vr')}`;
  return '';
}

function unitOfSpec(s: SeriesModel, spec: ParamSpec): string {
  return s.rows[0][0].values[spec.field]?.unit ?? '';
}

/** Title of the characteristics table; with conditions in titles it names the test currents. */
function tableTitle(ctx: Ctx, s: SeriesModel): string {
  const base = `Electrical characteristics, ${s.name} series`;
  if (ctx.pen.c.conditions === 'title') return `${base} (TA = 25 °C, ${seriesConditions(ctx, s)})`;
  return `${base} (TA = 25 °C unless otherwise stated)`;
}

const needsPackageColumn = (ctx: Ctx, s: SeriesModel) => s.packages.length > 1 || ctx.pen.c.maxRatings === 'per-package';

/** Series table with parts as rows. */
export function rowsTable(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  const { pen } = ctx;
  const c = pen.c;
  const specs = paramSpecs(ctx, s);
  const rotated = c.orientation === 'rotated';
  flow.newPage(rotated);
  const title = tableTitle(ctx, s);
  let y = pen.heading(title, pen.frame.left, flow.y, 9.5);
  const titlePage = pen.page;
  if (c.conditions === 'title' || c.conditions === 'header') recordSeriesConditions(ctx, s, titlePage);
  const unitInCell = c.units === 'each-value';
  const withPkg = needsPackageColumn(ctx, s);
  // Header lines.
  const groupName = (spec: ParamSpec) => (c.headerRows === 3 ? `${name(ctx, spec.key)}` : sym(ctx, spec.key));
  const unitText = (spec: ParamSpec) => bracketed(c, unitOfSpec(s, spec));
  const qw = (spec: ParamSpec) => qualifierWord(c, spec.qual);
  const lead: Array<{ text: string; width: number }> = [{ text: 'Type', width: 62 }];
  if (withPkg) lead.push({ text: 'Package', width: 46 });
  lead.push({ text: 'Marking', width: 34 });
  const n0 = lead.length;
  const size0 = 7.5;
  const fit = (texts: string[], bold = false) => Math.max(...texts.map((t) => pen.width(t, { size: size0, condensed: true, bold }))) + 8;
  const columns: GridColumn[] = [
    ...lead.map((l, i) => ({
      width: Math.max(
        l.width * 0.8,
        fit([l.text, ...s.rows.map((r) => (i === 0 ? r[0].printedMpn : withPkg && i === 1 ? r[0].pkg.name : r[0].marking))], true),
      ),
      align: 'left' as const,
    })),
    ...specs.map(() => ({ width: 0, align: 'center' as const })),
  ];
  const sizeColumns = (header: HeaderSpan[][]) => {
    specs.forEach((sp, i) => {
      const own = header.flatMap((line) => line.filter((h) => h.from === n0 + i && h.to === n0 + i).map((h) => h.text));
      columns[n0 + i].width = Math.max(fit(own, true), fit(s.rows.map((r, k) => cell(ctx, s, sp, r, k === 0, unitInCell, 0))), 26);
    });
    // A heading over several columns ("Zener voltage at IZT = 5 mA" over min/nom/max) widens
    // them to hold it: a printed table never runs one heading into the next.
    for (const h of header.flat()) {
      if (h.to === h.from) continue;
      const have = columns.slice(h.from, h.to + 1).reduce((a, b) => a + b.width, 0);
      const need = fit([h.text], true);
      if (need > have) for (let k = h.from; k <= h.to; k++) columns[k].width += (need - have) / (h.to - h.from + 1);
    }
    const total = columns.reduce((a, b) => a + b.width, 0);
    const avail = pen.frame.right - pen.frame.left;
    const scale = Math.min(1, avail / total);
    for (const col of columns) col.width *= scale;
    return size0 * scale;
  };
  const header: HeaderSpan[][] = [];
  const fnote = (text: string, spec: ParamSpec) => (spec.field === 'izt' || spec.field === 'vzNom' ? marked(ctx, text, 3, true) : text);
  if (c.headerRows === 1) {
    header.push([
      ...lead.map((l, i) => ({ text: l.text, from: i, to: i })),
      ...specs.map((sp, i) => {
        const cond = sp.qual === 'min' || sp.qual === '' || sp.key !== 'vz' ? headerCondition(ctx, s, sp) : '';
        const unit = c.units === 'header' ? ` ${unitText(sp)}` : '';
        return { text: fnote(`${sym(ctx, sp.key)}${sp.qual ? ` ${qw(sp)}` : ''}${cond}${unit}`, sp), from: n0 + i, to: n0 + i };
      }),
    ]);
  } else {
    // Group line: one span per quantity (VZ over min/nom/max), with the header condition.
    const groups: HeaderSpan[] = lead.map((l, i) => ({ text: l.text, from: i, to: i }));
    for (let i = 0; i < specs.length; i++) {
      const sp = specs[i];
      let j = i;
      while (j + 1 < specs.length && specs[j + 1].key === sp.key) j++;
      groups.push({ text: fnote(`${groupName(sp)}${headerCondition(ctx, s, sp)}`, sp), from: n0 + i, to: n0 + j });
      i = j;
    }
    header.push(groups);
    if (c.headerRows === 3) {
      header.push(specs.map((sp, i) => ({ text: sym(ctx, sp.key), from: n0 + i, to: n0 + i })));
    }
    header.push(
      specs.map((sp, i) => ({
        text: `${qw(sp)}${c.units === 'header' ? ` ${unitText(sp)}` : ''}`.trim(),
        from: n0 + i,
        to: n0 + i,
      })),
    );
  }
  if (c.units === 'units-row') header.push(specs.map((sp, i) => ({ text: unitOfSpec(s, sp), from: n0 + i, to: n0 + i })));
  const size = sizeColumns(header);
  const rowsPerChunk = c.pageBreak === 'none' ? 999 : Math.ceil(s.rows.length / 2);
  const chunks: PartModel[][][] = [];
  for (let i = 0; i < s.rows.length; i += rowsPerChunk) chunks.push(s.rows.slice(i, i + rowsPerChunk));
  chunks.forEach((chunk, k) => {
    if (k > 0) {
      pen.sheet.text('continued on next page', pen.frame.left, y, { size: 7 });
      pen.newPage(rotated);
      y = pen.frame.top;
      if (c.pageBreak === 'repeat-header') y = pen.heading(`${title} (continued)`, pen.frame.left, y, 9.5);
    }
    const page = pen.page;
    const rows = chunk.map((row, r) => {
      const first = k === 0 && r === 0;
      const lead2 = [row[0].printedMpn];
      if (withPkg) lead2.push(row[0].pkg.name);
      lead2.push(row[0].marking);
      if (withPkg) pen.recordPackage(row, page);
      return [...lead2, ...specs.map((sp) => cell(ctx, s, sp, row, first, unitInCell, page))];
    });
    const hdr = k === 0 || c.pageBreak === 'repeat-header' ? header : [];
    y = grid(pen, pen.frame.left, y + 4, columns, hdr, rows, { size, rowHeight: size + 4.5 });
  });
  flow.belowFullWidth(y + 4);
}

/** Series table with parts as columns (parameters as rows), a block of parts at a time. */
export function transposedTable(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  const { pen } = ctx;
  const c = pen.c;
  const specs = paramSpecs(ctx, s);
  const rotated = c.orientation === 'rotated';
  flow.newPage(rotated);
  const title = tableTitle(ctx, s);
  let y = pen.heading(title, pen.frame.left, flow.y, 9.5);
  if (c.conditions === 'title' || c.conditions === 'header') recordSeriesConditions(ctx, s, pen.page);
  const unitInCell = c.units === 'each-value';
  const unitCol = c.units === 'unit-column';
  const condCol = c.conditions === 'column';
  const withPkg = needsPackageColumn(ctx, s);
  const avail = pen.frame.right - pen.frame.left;
  const labelW = 120;
  const symW = 44;
  const condW = condCol ? 70 : 0;
  const unitW = unitCol ? 34 : 0;
  // As many parts side by side as their widest cell ("290 ohm @ 0.25 mA") leaves room for: a
  // printed table never lets one cell run into the next.
  // The part number over each column counts too ("VNAN-220W" ran into its neighbours).
  const widest = Math.max(
    ...s.rows.flatMap((row) => specs.map((sp) => pen.width(cell(ctx, s, sp, row, false, unitInCell, 0), { size: 7, condensed: true }))),
    ...s.rows.map((row) => pen.width(row[0].printedMpn, { size: 7, condensed: true, bold: true })),
  );
  const fits = Math.max(2, Math.min(6, Math.floor((avail - labelW - symW - condW - unitW) / (widest + 12))));
  // Blocks of even size: a last block of one part would be a table of one column.
  const perBlock = Math.ceil(s.rows.length / Math.ceil(s.rows.length / fits));
  const blocks: PartModel[][][] = [];
  for (let i = 0; i < s.rows.length; i += perBlock) blocks.push(s.rows.slice(i, i + perBlock));
  blocks.forEach((block, b) => {
    const partW = Math.min(Math.max(64, widest + 12), (avail - labelW - symW - condW - unitW) / block.length);
    const columns: GridColumn[] = [
      { width: labelW, align: 'left' },
      { width: symW, align: 'center' },
      ...(condCol ? [{ width: condW, align: 'left' as const }] : []),
      ...(unitCol ? [{ width: unitW, align: 'center' as const }] : []),
      ...block.map(() => ({ width: partW, align: 'center' as const })),
    ];
    const n0 = 2 + (condCol ? 1 : 0) + (unitCol ? 1 : 0);
    const lead = ['Parameter', 'Symbol', ...(condCol ? ['Conditions'] : []), ...(unitCol ? ['Unit'] : [])];
    const header: HeaderSpan[][] = [];
    if (c.headerRows === 3) header.push([{ text: `${s.name} series`, from: n0, to: n0 + block.length - 1 }]);
    if (c.headerRows >= 2) header.push([{ text: 'Type number', from: n0, to: n0 + block.length - 1 }]);
    header.push([...lead.map((text, i) => ({ text, from: i, to: i })), ...block.map((row, i) => ({ text: row[0].printedMpn, from: n0 + i, to: n0 + i }))]);
    const needed = (specs.length + 2) * 11 + header.length * 10 + 30;
    if (b > 0 && c.pageBreak !== 'none') {
      pen.newPage(rotated);
      y = pen.frame.top;
    } else if (y + needed > pen.frame.bottom) {
      pen.newPage(rotated);
      y = pen.frame.top;
    }
    const page = pen.page;
    const rows: string[][] = [];
    if (withPkg) {
      rows.push(['Package', '', ...(condCol ? [''] : []), ...(unitCol ? [''] : []), ...block.map((row) => row[0].pkg.name)]);
      for (const row of block) pen.recordPackage(row, page);
    }
    for (const sp of specs) {
      const unit = unitOfSpec(s, sp);
      let label = `${name(ctx, sp.key)}${sp.qual ? `, ${qualifierWord(c, sp.qual)}` : ''}${headerCondition(ctx, s, sp)}`;
      if (c.units === 'header') label += ` ${bracketed(c, unit)}`;
      let cond = '';
      if (condCol && sp.cond) {
        const cv = s.rows[0][0].values[sp.cond.field];
        const constant = sp.cond.field === 'izt' ? s.iztConst : sp.cond.field === 'izk' ? s.izkConst : undefined;
        cond = constant ? condText(ctx, sp.cond.key, constant) : cv ? `at ${sym(ctx, sp.cond.key)}` : '';
        if (constant) pen.record(block.flat(), sp.cond.field, page);
      }
      rows.push([
        label,
        b === 0 && sp.field === 'izt' ? marked(ctx, sym(ctx, sp.key), 3, true) : sym(ctx, sp.key),
        ...(condCol ? [cond] : []),
        ...(unitCol ? [unit] : []),
        ...block.map((row, i) => cell(ctx, s, sp, row, b === 0 && i === 0, unitInCell, page)),
      ]);
    }
    // Parts are the columns here: a block on a new page always names its parts (the row of type
    // numbers); without a repeated header only the spans above it are left out.
    y = grid(pen, pen.frame.left, y + 4, columns, b === 0 || c.pageBreak !== 'no-repeat' ? header : header.slice(-1), rows, { size: 7 });
  });
  flow.belowFullWidth(y + 4);
}

/** Parameter table for one part: Symbol | Parameter | Conditions | Min | Typ | Max | Unit. */
function partTable(ctx: Ctx, flow: Flow, s: SeriesModel, row: PartModel[], first: boolean, x: number, w: number): number {
  const { pen } = ctx;
  const c = pen.c;
  const p = row[0];
  const unitCol = c.units !== 'each-value' && c.units !== 'header';
  const unitInCell = c.units === 'each-value';
  const specs = paramSpecs(ctx, s).filter((sp) => !(sp.ownCondition && c.conditions === 'column'));
  let y = flow.y;
  const page = pen.page;
  let title = `${p.printedMpn}`;
  if (c.conditions === 'title') {
    const conds = [
      s.iztConst ? condText(ctx, 'izt', s.iztConst) : '',
      s.izkConst && s.hasIzk ? condText(ctx, 'izk', s.izkConst) : '',
      `${sym(ctx, 'vr')} = ${pen.vu(p.values.vr!)}`,
    ]
      .filter(Boolean)
      .join(', ');
    title += ` (TA = 25 °C, ${conds})`;
    if (s.iztConst) pen.record(row, 'izt', page);
    if (s.hasIzk && s.izkConst) pen.record(row, 'izk', page);
    pen.record(row, 'vr', page);
  }
  if (c.conditions === 'header') {
    if (s.iztConst) pen.record(row, 'izt', page);
    if (s.hasIzk && s.izkConst) pen.record(row, 'izk', page);
  }
  y = pen.heading(title, x, y, 9.5, w);
  pen.sheet.text(`Package: ${p.pkg.name}`, x, y - 4, { size: 7.5 });
  pen.recordPackage(row, page);
  y += 8;
  const fractions: GridColumn[] = [
    { width: 0.12, align: 'center' },
    { width: 0.3, align: 'left' },
    { width: 0.22, align: 'left' },
    { width: 0.1, align: 'center' },
    { width: 0.1, align: 'center' },
    { width: 0.1, align: 'center' },
    ...(unitCol ? [{ width: 0.06, align: 'center' as const }] : []),
  ];
  const columns: GridColumn[] = fractions.map((col) => ({ ...col, width: col.width * w * (unitCol ? 1 : 1.06) }));
  const head = ['Symbol', 'Parameter', 'Conditions', qualifierWord(c, 'min'), qualifierWord(c, 'typ'), qualifierWord(c, 'max'), ...(unitCol ? ['Unit'] : [])];
  const rows: string[][] = [];
  const vzRow: string[] = [];
  for (const sp of specs) {
    if (sp.ownCondition) {
      // Conditions printed as their own row: test current, knee current, VR.
      const v = p.values[sp.field]!;
      pen.record(row, sp.field, page);
      rows.push([
        sym(ctx, sp.key),
        name(ctx, sp.key) + (c.units === 'header' ? ` ${bracketed(c, v.unit)}` : ''),
        '',
        '',
        unitInCell ? pen.vu(v) : pen.num(v.value),
        '',
        ...(unitCol ? [v.unit] : []),
      ]);
      continue;
    }
    let cond = '';
    if (c.conditions === 'column' && sp.cond && !(sp.key === 'vz' && sp.qual !== 'nom' && vzRow.length)) {
      const cv = p.values[sp.cond.field]!;
      pen.record(row, sp.cond.field, page);
      cond = `${sym(ctx, sp.cond.key)} = ${pen.vu(cv)}`;
    }
    const text = cell(ctx, s, sp, row, first, unitInCell, page);
    const unit = unitOfSpec(s, sp);
    const label = `${name(ctx, sp.key)}${headerCondition(ctx, s, sp)}${c.units === 'header' ? ` ${bracketed(c, unit)}` : ''}`;
    if (sp.key === 'vz') {
      if (!vzRow.length) vzRow.push(sym(ctx, 'vz'), label, cond, '', '', '', ...(unitCol ? [unit] : []));
      const at = sp.qual === 'min' ? 3 : sp.qual === 'nom' ? 4 : 5;
      vzRow[at] = text;
      if (sp.qual === 'max' || (s.legend && sp.qual === 'nom')) rows.push(vzRow);
      continue;
    }
    const at = sp.qual === 'max' ? 5 : sp.qual === 'min' ? 3 : 4;
    const r = [sym(ctx, sp.key), label, cond, '', '', '', ...(unitCol ? [unit] : [])];
    r[at] = text;
    rows.push(r);
  }
  return grid(pen, x, y, columns, [head.map((text, i) => ({ text, from: i, to: i }))], rows, { size: w < 300 ? 6 : 7.5, fit: true });
}

export function paramTables(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  const rotated = ctx.pen.c.orientation === 'rotated';
  s.rows.forEach((row, i) => {
    flow.need(150, rotated);
    flow.y = partTable(ctx, flow, s, row, i === 0, flow.x, flow.width) + 6;
  });
}

export function partPerPage(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  const { pen } = ctx;
  const rotated = pen.c.orientation === 'rotated';
  s.rows.forEach((row, i) => {
    flow.newPage(rotated);
    pen.sheet.text(`${row[0].printedMpn}`, pen.frame.left, flow.y, { size: 15, bold: true });
    flow.y += 26;
    flow.y =
      pen.prose(
        `${name(ctx, 'vz')} regulator diode of the ${s.name} series. All values at TA = 25 °C.`,
        pen.frame.left,
        flow.y,
        pen.frame.right - pen.frame.left,
      ) + 6;
    flow.belowFullWidth(partTable(ctx, flow, s, row, i === 0, pen.frame.left, pen.frame.right - pen.frame.left) + 6);
  });
}

/** Key–value leader lists, one block per part, with prose around them. */
export function leaderLists(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  const { pen } = ctx;
  const c = pen.c;
  const rotated = c.orientation === 'rotated';
  const specs = paramSpecs(ctx, s);
  flow.need(60, rotated);
  flow.y = pen.prose(
    `The ${s.name} types are listed below with their characteristics at 25 °C. Limits are tested on every part; ` +
      `typical values are given for design guidance only and are not tested.`,
    flow.x,
    flow.y,
    flow.width,
  );
  s.rows.forEach((row, r) => {
    const p = row[0];
    flow.need((specs.length + 3) * 11 + 10, rotated);
    const page = pen.page;
    let title = p.printedMpn;
    if (c.conditions === 'title') {
      title += ` (${[s.iztConst ? condText(ctx, 'izt', s.iztConst) : '', s.hasIzk && s.izkConst ? condText(ctx, 'izk', s.izkConst) : ''].filter(Boolean).join(', ')})`;
      if (s.iztConst) pen.record(row, 'izt', page);
      if (s.hasIzk && s.izkConst) pen.record(row, 'izk', page);
    }
    let y = pen.heading(title, flow.x, flow.y, 9.5);
    const w = flow.width;
    leader(ctx, flow.x, y, w, 'Package', p.pkg.name);
    pen.recordPackage(row, page);
    y += 11;
    for (const sp of specs) {
      const v = p.values[sp.field]!;
      const unit = v.unit;
      let label = `${name(ctx, sp.key)}${sp.qual ? ` ${qualifierWord(c, sp.qual)}` : ''}, ${sym(ctx, sp.key)}`;
      if (c.conditions === 'header' || c.conditions === 'column') {
        // A condition in the label ("at IZT = 5 mA"); with conditions "column" it repeats the part's own value.
        if (sp.cond && !(sp.cond.key === 'izt' && ownIzt(ctx, s)) && !(sp.cond.key === 'izk' && ownIzk(ctx, s)) && !(sp.cond.key === 'vr' && ownVr(ctx))) {
          const constant = sp.cond.field === 'izt' ? s.iztConst : s.izkConst;
          if (constant) {
            label += ` at ${condText(ctx, sp.cond.key, constant)}`;
            pen.record(row, sp.cond.field, page);
          }
        }
        if (sp.cond?.key === 'vr' && ownVr(ctx)) label += ` at ${sym(ctx, 'vr')}`;
      }
      if (c.units === 'header') label += ` ${bracketed(c, unit)}`;
      // A value with "@ condition" carries its own unit (a unit after the condition would be ambiguous).
      const own = c.units === 'each-value' || (c.units === 'unit-column' && atSign(ctx, s, sp));
      const text = cell(ctx, s, sp, row, r === 0, own, page);
      leader(ctx, flow.x, y, w, label, text, c.units === 'unit-column' && !own ? unit : '');
      y += 11;
    }
    flow.y = y + 6;
  });
  flow.need(30, rotated);
  flow.y =
    pen.prose(
      `Measured with pulses of 20 ms so that the junction stays near the ambient; ${sym(ctx, 'zzt')} with 10 % a.c. at 1 kHz.`,
      flow.x,
      flow.y,
      flow.width,
      7.5,
    ) + 6;
}

/** Ratings given in sentences, one paragraph per part. */
export function sentences(ctx: Ctx, flow: Flow, s: SeriesModel): void {
  const { pen, prng } = ctx;
  const c = pen.c;
  const rotated = c.orientation === 'rotated';
  const template = prng.int(0, 1);
  s.rows.forEach((row, r) => {
    const p = row[0];
    const v = p.values;
    flow.need(70, rotated);
    const page = pen.page;
    const at = (f: Field) => pen.vu(v[f]!);
    const mk = (f: Field) => `${marked(ctx, pen.num(v[f]!.value), 2, r === 0 && f === 'vzNom')} ${v[f]!.unit}`;
    const record = (...fs: Field[]) => fs.forEach((f) => v[f] && pen.record(row, f, page));
    const range = s.legend ? '' : ` (${at('vzMin')} to ${at('vzMax')})`;
    const tail = `${v.izk ? ` and at most ${at('zzk')} at ${at('izk')}` : ''}`;
    const izm = v.izm ? ` The current must stay below ${at('izm')}.` : '';
    const at$ = c.conditions === 'at-sign';
    const text =
      template === 0
        ? `The ${p.printedMpn} (${p.pkg.name}) regulates at ${mk('vzNom')}${range} ${at$ ? '@' : 'when driven at'} ${at('izt')}; ` +
          `its ${name(ctx, 'zzt').toLowerCase()} there is at most ${at('zzt')}${tail}. ` +
          `Leakage stays below ${at('irMax')} ${at$ ? '@' : 'at'} ${at('vr')}, and the voltage drifts by ${mk('tc')} typically.${izm}`
        : `${p.printedMpn}, ${p.pkg.name}: ${sym(ctx, 'vz')} is ${mk('vzNom')} nominal${range} measured at ${sym(ctx, 'izt')} = ${at('izt')}. ` +
          `${sym(ctx, 'zzt')} does not exceed ${at('zzt')}${tail}. ${sym(ctx, 'ir')} is ${at('irMax')} maximum at ${sym(ctx, 'vr')} = ${at('vr')}; ` +
          `${sym(ctx, 'tc')} is ${mk('tc')} typical.${izm}`;
    record('vzNom', 'vzMin', 'vzMax', 'izt', 'zzt', 'zzk', 'izk', 'irMax', 'vr', 'tc', 'izm');
    pen.recordPackage(row, page);
    flow.y = pen.prose(text, flow.x, flow.y, flow.width) + 6;
  });
}
