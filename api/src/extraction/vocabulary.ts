import type { ExtractionField, QuantityKind } from '@shuntwise/contracts';

/**
 * The words and symbols datasheets use for each rating, and the physical dimension each
 * rating must have: data, in one place, read by every reader (tables, lists, sentences,
 * device-wide ratings). A header or label is recognised by its words AND by the dimension of
 * its unit: "IZT" over a column of mA values is a current, a header whose unit is a voltage
 * can never be an impedance. Spellings are common practice in the trade (no source).
 */

/** The dimensions a field's value may have (the kinds of @shuntwise/contracts' unit parser). */
export const FIELD_KINDS: Record<ExtractionField, readonly QuantityKind[]> = {
  vzMin: ['voltage'],
  vzNom: ['voltage'],
  vzMax: ['voltage'],
  izt: ['current'],
  zzt: ['resistance'],
  izk: ['current'],
  zzk: ['resistance'],
  irMax: ['current'],
  vr: ['voltage'],
  tc: ['tempCoVoltage', 'tempCoPercent'],
  pdMax: ['power'],
  tjMax: ['temperature'],
  rthJA: ['thermalResistance'],
  izm: ['current'],
};

/**
 * What a regulator diode's ratings can physically be, in SI (common practice, no source): a
 * number outside is a misreading (a lost µ, a date, a page number) and is not returned.
 */
export const PLAUSIBLE: Record<ExtractionField, readonly [number, number]> = {
  vzMin: [0.5, 2000],
  vzNom: [0.5, 2000],
  vzMax: [0.5, 2000],
  izt: [1e-6, 20],
  zzt: [0.01, 1e5],
  izk: [1e-7, 5],
  zzk: [0.01, 1e6],
  irMax: [1e-12, 0.1],
  vr: [0.05, 2000],
  tc: [-1, 1],
  pdMax: [1e-3, 1e4],
  tjMax: [60, 300],
  rthJA: [0.1, 5000],
  izm: [1e-5, 500],
};

/** Symbols and words per rating, for headers, row labels and list keys. */
export const LABELS = {
  zzk: /\bZ\s?ZK\b|\br\s?zk\b|\bknee\s+imp|\b(?:resistance|impedance)\s+at\s+the\s+knee/i,
  zzt: /\bZ\s?ZT\b|\bZ\s?Z\b|\br\s?zj?\b|\bdyn(?:amic|\.)?\s*(?:imp|res)|\bdifferential\s+res|\bzener\s+imp/i,
  izk: /\bI\s?ZK\b|\bI\s?Z\s?\(K\)|\bI\s?K\b|\bknee\b/i,
  izm: /\bI\s?ZM\b|\bI\s?Z\s?\(?max\)?|\bmax(?:imum|\.)?\s+(?:zener|regulator|working)\s+current/i,
  izt: /\bI\s?ZT\b|\bI\s?T\b|\bI\s?test\b|\btest(?:\s+current)?\b|\bmeasuring\s+current/i,
  ir: /\bI\s?RM?\b|\bI\s?D\b|\bleakage\b|\breverse\s+(?:leakage\s+)?current/i,
  vr: /\bV\s?RM?\b|\bU\s?R\b|\breverse\s+(?:test\s+)?voltage|\btest\s+voltage/i,
  vz: /\b[VU]\s?Z(?:min|nom|max|typ)?\b|\bV\s?\(?BR\)?|\b(?:zener|breakdown|working|regulation)\s+voltage|\bregulates\b/i,
  tc: /α|\bθ\s?VZ|\bTC\b|\bT\s?K\s?VZ\b|\bS\s?Z\b|\btemp(?:erature|\.)?\s*co|\bdrifts?\b/i,
  pd: /\bP\s?(?:tot|D|Z)\b|\bpower\s+(?:dissipation|rating)\b/i,
  tj: /\bjunction\s+temp|\bT\s?(?:v?j)(?:\s?max)?\b|\boperating\s+(?:junction\s+)?temp/i,
  rthJA: /\bR\s?(?:th|θ)\s?\(?j-?a\)?|\bθ\s?JA\b|\bjunction[\s-]+to[\s-]+ambient/i,
  notRthJA: /\bR\s?(?:th|θ)\s?\(?j-?[lcst]\)?|\bθ\s?J[LCT]\b|\bto\s+(?:lead|case|tab|board|solder)/i,
  packageHeader: /\bpackage\b|\bcase\b/i,
};

/** Symbols that name a current column unambiguously, checked before the words. */
export const CURRENT_SYMBOLS: ReadonlyArray<[RegExp, 'izk' | 'izm' | 'izt' | 'irMax']> = [
  [/\bI\s?ZK\b|\bI\s?Z\s?\(K\)|\bI\s?K\b/i, 'izk'],
  [/\bI\s?ZM\b|\bI\s?Z\s?\(?max\b/i, 'izm'],
  // "IZ" alone is the test current; "IZ(K)" and "IZ (max)" are others ("IZ (Note 3)" is still IZ).
  [/\bI\s?ZT\b|\bI\s?T\b|\bI\s?test\b|\bI\s?Z\b(?!\s?\((?:K|max)\b)/i, 'izt'],
  [/\bI\s?RM?\b|\bI\s?D\b/i, 'irMax'],
];

/** A device-wide rating (printed once, or once per series or package) and how to find it. */
export interface DeviceRule {
  symbol: RegExp;
  words: RegExp;
  exclude: RegExp;
  kind: QuantityKind;
  /** Ranges such as "−55 to +150 °C" give their upper end. */
  upperOfRange?: boolean;
}

export const DEVICE_RULES: Record<'pdMax' | 'tjMax' | 'rthJA', DeviceRule> = {
  pdMax: {
    symbol: /\bP\s?(?:tot|[DdZ])\b/,
    words: /\b(?:total\s+|continuous\s+)?power\s+(?:dissipation|rating)\b/i,
    exclude: /surge|peak|pulse|non-repetitive|derat|\bP\s?[ZR]SM\b|above|per\s+(?:K|°C)/i,
    kind: 'power',
  },
  tjMax: {
    symbol: /\bT\s?v?[jJ](?:\s?max)?\b/,
    words: /\bjunction\s+temp|\boperating\s+(?:junction\s+)?temp|\bjunction\b[^.;]{0,20}\boperat/i,
    exclude: /^(?!.*junction).*(?:storage|solder|reflow|lead\s+temp|wave)|solder|reflow|\bT\s?stg\b/i,
    kind: 'temperature',
    upperOfRange: true,
  },
  rthJA: {
    symbol: /\bR\s?(?:th|θ)\s?\(?j-?a\)?|\bθ\s?JA\b/i,
    words: /\bjunction[\s-]+to[\s-]+ambient|\bthermal\s+resistance\b(?!.*\b(?:lead|case|tab|solder))/i,
    exclude: LABELS.notRthJA,
    kind: 'thermalResistance',
  },
};

/**
 * Test conditions written "SYMBOL = value unit". The card fields among them are bound to the
 * value they qualify; the others (temperatures, frequency, pulse time, forward current) are
 * cut from the text so that their numbers are never read as a rating: "Ptot at TA = 25 °C" is
 * a power, and its 25 °C is no junction temperature.
 */
export const CONDITION_SYMBOL =
  /(?<![\p{L}\p{N}])(I\s?Z\s?\(K\)|I\s?Z\s?T|I\s?Z\s?K|I\s?test|I\s?T|I\s?K|I\s?Z|V\s?RM|V\s?R|U\s?R|I\s?F|I\s?RM?|T\s?(?:amb|case|stg|sp|[ajcl]|A|J|C|L)?|f|t\s?p)\s*[=≈≤<]\s*/giu;

/** "at 25 °C", "@ TA 25 °C", "(25 °C)": a temperature that qualifies, never a rating of its own. */
export const TEMPERATURE_QUALIFIER = /(?:\b(?:at|up\s+to|below|above)\b|@|\()\s*(?:T\s?(?:amb|[ajcAJC])?\s*)?[+]?\d+(?:\.\d+)?\s?(?:°C|℃|K\b)\)?/giu;

/** Which card field a condition symbol names, by the dimension of its value. */
export function conditionField(symbol: string, kind: QuantityKind | undefined, context?: ExtractionField): 'izt' | 'izk' | 'vr' | undefined {
  const s = symbol.replace(/\s/g, '').toUpperCase();
  if ((s === 'IZT' || s === 'IT' || s === 'ITEST') && kind === 'current') return 'izt';
  if ((s === 'IZK' || s === 'IK' || s === 'IZ(K)') && kind === 'current') return 'izk';
  if (s === 'IZ' && kind === 'current') return context === 'zzk' ? 'izk' : 'izt';
  if ((s === 'VR' || s === 'VRM' || s === 'UR') && kind === 'voltage') return 'vr';
  return undefined;
}

/** A condition after "@" or "at" with no symbol ("144 Ω @ 0.25 mA"): its field follows from the value it qualifies. */
export function bareConditionField(kind: QuantityKind | undefined, context?: ExtractionField): 'izt' | 'izk' | 'vr' | undefined {
  if (!context) return undefined;
  if (kind === 'current') {
    if (context === 'zzk') return 'izk';
    if (context === 'zzt' || context === 'vzNom' || context === 'vzMin' || context === 'vzMax' || context === 'tc') return 'izt';
    return undefined;
  }
  if (kind === 'voltage' && context === 'irMax') return 'vr';
  return undefined;
}

/** Words that make a table something other than ratings per part: ordering and packing data. */
export const NOT_RATINGS_TABLE = /\b(?:order(?:ing)?|packing|packaging|reel|tape|marking|quantity|MOQ|weight)\b/i;

/** A tolerance legend: "B ±2 %", "suffix C: ±5 %", "A = ±1%". */
export const TOLERANCE_LEGEND = /(?:^|[\s,;(])(?:suffix\s+)?["“]?([A-Z])["”]?\s*(?:[:=]\s*|\s)±\s?(\d+(?:\.\d+)?)\s?%/g;
/** What makes such letters a tolerance legend rather than anything else with ± in it. */
export const TOLERANCE_LEGEND_CONTEXT = /\btolerance\b[^.]*\b(?:letter|suffix)\b|\b(?:letter|suffix)\b[^.]*\btolerance\b/i;
