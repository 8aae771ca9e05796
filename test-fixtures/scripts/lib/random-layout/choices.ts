import { Prng } from '../prng';

/**
 * The independent layout choices a random datasheet is drawn from. Every choice is drawn on
 * its own, so any value of one meets any value of another; where a value cannot apply to an
 * arrangement (a Unit column in a series table with parts as rows) the drawing uses the
 * nearest form and `normaliseChoices` records what was actually drawn.
 */

export const ARRANGEMENTS = ['rows', 'transposed', 'part-per-page', 'leader-list', 'param-table', 'sentences'] as const;
export type Arrangement = (typeof ARRANGEMENTS)[number];

export interface LayoutChoices {
  /** How the per-part characteristics are laid out. */
  arrangement: Arrangement;
  /** Header lines of series tables (parts as rows or as columns). */
  headerRows: 1 | 2 | 3;
  /** Footnote markers stuck to some values and headers: 5.1⁽²⁾, IZT (Note 3). */
  footnotes: boolean;
  /** Where units stand. */
  units: 'header' | 'units-row' | 'each-value' | 'unit-column';
  /** Where test conditions (IZT, IZK, VR) stand. */
  conditions: 'header' | 'column' | 'at-sign' | 'title';
  decimal: 'point' | 'comma';
  micro: 'µ' | 'μ' | 'u';
  ohm: '\u03A9' | '\u2126' | 'ohm';
  tcUnit: 'mV/K' | 'mV/°C' | '%/K' | '%/°C';
  rthUnit: 'K/W' | '°C/W';
  /** A derating figure in mW/K beside the power rating (a number that is not RthJA). */
  derating: boolean;
  /** How the maximum ratings (power, Tj, RthJA) are given. */
  maxRatings: 'once' | 'per-series' | 'per-package';
  /** Form of the maximum-ratings block. */
  ratingsForm: 'table' | 'list' | 'sentence';
  /** Series in the PDF; two series have different test currents and power. */
  series: 1 | 2;
  /** VZ limits printed in min/max columns, or only a tolerance letter suffix with a legend. */
  tolerance: 'min-max' | 'suffix-legend';
  /** An ordering table of codes (base part number + packing suffix). */
  orderingCodes: boolean;
  /** Pages with the characteristics drawn upright or turned by 90° (landscape on a portrait page). */
  orientation: 'portrait' | 'rotated';
  /** Text columns on the pages (the maximum ratings sit in the right-hand one of two). */
  pageColumns: 1 | 2;
  ruled: boolean;
  /** One text run per cell or line, per word, or per glyph. */
  placement: 'line' | 'word' | 'glyph';
  /** Characteristics continued on another page, with or without the header repeated. */
  pageBreak: 'none' | 'repeat-header' | 'no-repeat';
  /** Material full of numbers that are not ratings. */
  clutter: Array<'prose' | 'curves' | 'outline' | 'example'>;
  /** The vendor's words and symbols. */
  vocabulary: Vocabulary;
  /** How limits are qualified: min/nom/max, Min./Typ./Max., minimum/nominal/maximum. */
  qualifiers: 'lower' | 'dot' | 'words';
  /** Brackets around a unit in a header or label: (V) or [V]. */
  unitBrackets: '()' | '[]';
  /** Image-only pages (a scan made by a rasteriser); never drawn at random, OCR is slow. */
  imageOnly?: boolean;
}

export type VocabKey = 'vz' | 'izt' | 'zzt' | 'izk' | 'zzk' | 'ir' | 'vr' | 'tc' | 'izm' | 'pd' | 'tj' | 'rth';
export type Vocabulary = Record<VocabKey, { symbol: string; name: string }>;

/** Symbols and words vendors use for each rating (one of each is drawn per vendor). */
export const VOCABULARY: Record<VocabKey, { symbols: string[]; names: string[] }> = {
  vz: { symbols: ['VZ', 'UZ', 'V(BR)', 'VBR'], names: ['Zener voltage', 'Breakdown voltage', 'Regulation voltage', 'Working voltage'] },
  izt: { symbols: ['IZT', 'IZ', 'IT', 'Itest'], names: ['Test current', 'Zener test current', 'Measuring current'] },
  zzt: {
    symbols: ['ZZT', 'rZ', 'rzj', 'ZZ'],
    names: ['Dynamic resistance', 'Dynamic impedance', 'Differential resistance', 'Zener impedance'],
  },
  izk: { symbols: ['IZK', 'IK', 'IZ(K)'], names: ['Knee current', 'Current at the knee'] },
  zzk: { symbols: ['ZZK', 'rZK', 'rzk'], names: ['Knee impedance', 'Dynamic resistance at the knee'] },
  ir: { symbols: ['IR', 'IRM', 'ID'], names: ['Reverse leakage current', 'Leakage current', 'Reverse current'] },
  vr: { symbols: ['VR', 'UR', 'VRM'], names: ['Reverse voltage', 'Test voltage', 'Reverse test voltage'] },
  tc: {
    symbols: ['αVZ', 'TC', 'TKVZ', 'αZ', 'SZ'],
    names: ['Temperature coefficient of VZ', 'Temperature coefficient', 'Voltage temperature coefficient'],
  },
  izm: { symbols: ['IZM', 'IZmax', 'IZ(max)'], names: ['Maximum regulator current', 'Max. Zener current', 'Maximum working current'] },
  pd: { symbols: ['Ptot', 'PD', 'Pd', 'PZ'], names: ['Power dissipation', 'Total power dissipation', 'Continuous power dissipation'] },
  tj: { symbols: ['Tj', 'TJ', 'Tjmax', 'Tvj'], names: ['Junction temperature', 'Operating junction temperature', 'Maximum junction temperature'] },
  rth: {
    symbols: ['RthJA', 'RθJA', 'θJA', 'Rth(j-a)'],
    names: ['Thermal resistance, junction to ambient', 'Thermal resistance junction to ambient air', 'Junction-to-ambient thermal resistance'],
  },
};

export function drawVocabulary(prng: Prng): Vocabulary {
  const out = {} as Vocabulary;
  for (const key of Object.keys(VOCABULARY) as VocabKey[]) {
    out[key] = { symbol: prng.pick(VOCABULARY[key].symbols), name: prng.pick(VOCABULARY[key].names) };
  }
  return out;
}

export function drawChoices(prng: Prng): LayoutChoices {
  const clutter: LayoutChoices['clutter'] = [];
  for (const c of ['prose', 'curves', 'outline', 'example'] as const) if (prng.next() < 0.5) clutter.push(c);
  return {
    arrangement: prng.pick(ARRANGEMENTS),
    headerRows: prng.pick([1, 2, 3] as const),
    footnotes: prng.next() < 0.5,
    units: prng.pick(['header', 'units-row', 'each-value', 'unit-column'] as const),
    conditions: prng.pick(['header', 'column', 'at-sign', 'title'] as const),
    decimal: prng.pick(['point', 'comma'] as const),
    micro: prng.pick(['µ', 'μ', 'u'] as const),
    ohm: prng.pick(['\u03A9', '\u2126', 'ohm'] as const),
    tcUnit: prng.pick(['mV/K', 'mV/°C', '%/K', '%/°C'] as const),
    rthUnit: prng.pick(['K/W', '°C/W'] as const),
    derating: prng.next() < 0.5,
    maxRatings: prng.pick(['once', 'per-series', 'per-package'] as const),
    ratingsForm: prng.pick(['table', 'list', 'sentence'] as const),
    series: prng.pick([1, 2] as const),
    tolerance: prng.next() < 0.7 ? 'min-max' : 'suffix-legend',
    orderingCodes: prng.next() < 0.5,
    orientation: prng.next() < 0.8 ? 'portrait' : 'rotated',
    pageColumns: prng.pick([1, 2] as const),
    ruled: prng.next() < 0.5,
    placement: prng.pick(['line', 'word', 'glyph'] as const),
    pageBreak: prng.pick(['none', 'repeat-header', 'no-repeat'] as const),
    clutter,
    vocabulary: drawVocabulary(prng),
    qualifiers: prng.pick(['lower', 'dot', 'words'] as const),
    unitBrackets: prng.pick(['()', '[]'] as const),
  };
}

const QUALIFIERS: Record<LayoutChoices['qualifiers'], Record<'min' | 'nom' | 'typ' | 'max', string>> = {
  lower: { min: 'min', nom: 'nom', typ: 'typ', max: 'max' },
  dot: { min: 'Min.', nom: 'Typ.', typ: 'Typ.', max: 'Max.' },
  words: { min: 'minimum', nom: 'nominal', typ: 'typical', max: 'maximum' },
};

/** A qualifier word in the vendor's style ('' stays ''). */
export function qualifierWord(c: LayoutChoices, q: '' | 'min' | 'nom' | 'typ' | 'max'): string {
  return q ? QUALIFIERS[c.qualifiers][q] : '';
}

/** A unit in the vendor's brackets. */
export function bracketed(c: LayoutChoices, unit: string): string {
  return c.unitBrackets === '[]' ? `[${unit}]` : `(${unit})`;
}

/** What the arrangement actually drew for choices that do not apply to it. */
export function normaliseChoices(c: LayoutChoices): LayoutChoices {
  const out = { ...c };
  const table = c.arrangement === 'rows' || c.arrangement === 'transposed';
  if (!table) out.headerRows = 1;
  if (c.arrangement === 'rows' && c.units === 'unit-column') out.units = 'units-row';
  if (c.arrangement === 'transposed' && c.units === 'units-row') out.units = 'unit-column';
  if ((c.arrangement === 'param-table' || c.arrangement === 'part-per-page') && c.units === 'units-row') out.units = 'unit-column';
  if (c.arrangement === 'leader-list' && c.units === 'units-row') out.units = 'unit-column';
  if (c.arrangement === 'sentences') out.units = 'each-value';
  if (c.arrangement === 'sentences' && c.conditions !== 'at-sign') out.conditions = 'column';
  if (!table) out.pageBreak = c.arrangement === 'part-per-page' ? 'repeat-header' : 'none';
  return out;
}

/** Flat "name=value" labels of a choice set, for scoring per choice value. */
export function choiceLabels(c: LayoutChoices): string[] {
  const out: string[] = [];
  for (const [k, v] of Object.entries(c)) {
    if (k === 'vocabulary') {
      for (const [vk, w] of Object.entries(v as Vocabulary)) out.push(`symbol.${vk}=${w.symbol}`, `name.${vk}=${w.name}`);
    } else if (k === 'clutter') {
      for (const item of ['prose', 'curves', 'outline', 'example']) out.push(`clutter.${item}=${(v as string[]).includes(item)}`);
    } else if (k === 'micro' || k === 'ohm') {
      // µ/μ and Ω/Ω look alike: the code point tells them apart in a report.
      const ch = String(v);
      out.push(`${k}=${ch}${ch.length === 1 && ch.charCodeAt(0) > 127 ? ` U+${ch.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}` : ''}`);
    } else out.push(`${k}=${String(v)}`);
  }
  return out;
}

const ONSETS = ['b', 'br', 'd', 'dr', 'f', 'g', 'gl', 'h', 'k', 'kl', 'l', 'm', 'n', 'p', 'pl', 'r', 's', 'st', 't', 'tr', 'v', 'w', 'z'];
const VOWELS = ['a', 'e', 'i', 'o', 'u', 'ai', 'ou', 'ea'];
const CODAS = ['', '', 'n', 'r', 'l', 'm', 'sk', 'nd', 'rt', 'th', 'x'];
const SUFFIXES = ['Semiconductor', 'Devices', 'Microsystems', 'Components', 'Silicon Works', 'Electronics', 'Diode Company'];

function syllable(prng: Prng): string {
  return prng.pick(ONSETS) + prng.pick(VOWELS) + prng.pick(CODAS);
}

/** An invented vendor: two or three random syllables and a trade word. */
export function vendorName(prng: Prng): string {
  let word = '';
  const n = prng.int(2, 3);
  for (let i = 0; i < n; i++) word += syllable(prng);
  return `${word[0].toUpperCase()}${word.slice(1)} ${prng.pick(SUFFIXES)}`;
}

/** Common generic diode prefixes are avoided so that no invented part number looks like a real family. */
const AVOID = /^(BZ|MM|TZ|PZ|DZ|SM|1N|ZM|ZP|UD|RD|HZ|GD|KD)/;

/** A part-number prefix of 2 to 4 capitals. */
export function partPrefix(prng: Prng, vendor: string): string {
  const letters = 'ABCDEFGHJKLMNPRSTVWXY';
  for (;;) {
    let p = vendor[0].toUpperCase();
    const n = prng.int(1, 3);
    for (let i = 0; i < n; i++) p += letters[prng.int(0, letters.length - 1)];
    if (!AVOID.test(p)) return p;
  }
}
