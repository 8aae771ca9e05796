/** Invented demo data for Shuntwise: datasheets with answer keys, bad uploads, the demo catalogue. */

export type RatingField = 'vzMin' | 'vzNom' | 'vzMax' | 'izt' | 'zzt' | 'izk' | 'zzk' | 'irMax' | 'vr' | 'tc' | 'pdMax' | 'tjMax' | 'rthJA' | 'izm';

/** A value as printed (value and unit text), its SI value (V, A, Ω, W, °C, K/W, V/K) and its page. */
export interface AnswerValue {
  value: string;
  unit: string;
  si: number;
  page: number;
}

export interface AnswerVariant {
  mpn: string;
  package: { value: string; page: number };
  fields: Partial<Record<RatingField, AnswerValue>>;
}

export interface AnswerKey {
  file: string;
  vendor: string;
  title: string;
  layout: string;
  pages: number;
  variants: AnswerVariant[];
}

export interface DatasheetFixture {
  name: string;
  pdfPath: string;
  answersPath: string;
  answers: AnswerKey;
}

export interface CatalogueSpec {
  version: number;
  /** Reference current, A. */
  iRef: number;
  /** Zener-voltage window at iRef and 25 °C, V. */
  vz: { min: number; nom: number; max: number };
  /** Maximum dynamic impedance at iRef, Ω. */
  zdMax: number;
  /** Knee limit: Zd(iKnee)/Zd(iRef) at most maxRatio, and/or voltage span over iMin..iMax at most maxSpan (V). */
  knee: { iKnee: number; maxRatio: number | null; maxSpan: number | null };
  /** Maximum leakage (A) at reverse voltage vr (V). */
  leakage: { irMax: number; vr: number };
  /** Temperature-coefficient window, V/K. */
  tc: { min: number; max: number };
  /** Minimum power rating (W) and the largest fraction of the derated rating that may be used. */
  power: { pdMin: number; deratingFraction: number };
  packages: string[];
  /** Application envelope: operating current (A) and ambient (°C). */
  envelope: { iMin: number; iMax: number; taMin: number; taMax: number };
  /** Optional output window over the whole envelope, V. */
  outputWindow: { vMin: number; vMax: number } | null;
  /** A check whose margin (fraction of its limit) is below this is marginal. */
  marginalBand: number;
}

export type IntentVerdict = 'pass' | 'marginal' | 'fail' | 'no data';

export interface CatalogueSource {
  vendor: string;
  mpn: string;
  role: 'approved' | 'alternate';
  /** What the demo was built to show, from the generator's simplified check; the qualification engine decides. */
  intent: { verdict: IntentVerdict; reason: string };
}

export interface CatalogueHousePart {
  partNumber: string;
  description: string;
  status: 'active' | 'not-for-new-designs' | 'end-of-life';
  spec: CatalogueSpec;
  sources: CatalogueSource[];
}

export interface CatalogueCardField {
  /** SI value. */
  value: number;
  /** As printed, value and unit, e.g. "−1.8 mV/°C". */
  printed: string;
  page: number;
  /** tc only: the unit printed, as the card keeps it (mV/°C counts as mV/K), and the value in it. */
  unit?: 'mV/K' | '%/K';
  valueInUnit?: number;
}

export interface CatalogueVendorPart {
  vendor: string;
  mpn: string;
  package: string;
  lifecycle: string;
  lifecycleNote: string;
  /** The datasheet and the page of the part's main values. */
  datasheet: { file: string; page: number };
  ratingCard: { pdRefC: number; fields: Partial<Record<RatingField, CatalogueCardField>> };
}

export interface DemoCatalogue {
  about: string;
  company: { name: string; shortName: string; description: string };
  vendors: Array<{ code: string; name: string; note: string }>;
  datasheets: Array<{ file: string; vendor: string; title: string; layout: string; pages: number }>;
  vendorParts: CatalogueVendorPart[];
  houseParts: CatalogueHousePart[];
}

export declare const paths: {
  root: string;
  datasheets: string;
  badUploads: string;
  catalogue: string;
  scanned: string;
  demoCatalogue: string;
  measurements: string;
};

export declare const badUploads: {
  notPdf: string;
  empty: string;
  truncated: string;
  corrupt: string;
  encrypted: string;
  scanned: string;
};

export declare function loadDemoCatalogue(): DemoCatalogue;
export declare function listDatasheetFixtures(): DatasheetFixture[];

/** An invented bench measurement file of a demo vendor part (vendor code and mpn as in the catalogue). */
export interface MeasurementFixture {
  file: string;
  csvPath: string;
  vendor: string;
  mpn: string;
  instrument: string;
  measuredOn: string;
  note: string;
}
export declare function listMeasurementFixtures(): MeasurementFixture[];

/** A value of a random datasheet's answer key; `derived` when it is not printed as such (min/max from a tolerance letter). */
export interface RandomAnswerValue extends AnswerValue {
  derived?: 'tolerance-suffix';
}

/** The layout choices a random datasheet was drawn with (see README.md, "Random layouts"). */
export interface LayoutChoices {
  arrangement: 'rows' | 'transposed' | 'part-per-page' | 'leader-list' | 'param-table' | 'sentences';
  headerRows: 1 | 2 | 3;
  footnotes: boolean;
  units: 'header' | 'units-row' | 'each-value' | 'unit-column';
  conditions: 'header' | 'column' | 'at-sign' | 'title';
  decimal: 'point' | 'comma';
  micro: 'µ' | 'μ' | 'u';
  ohm: '\u03A9' | '\u2126' | 'ohm';
  tcUnit: 'mV/K' | 'mV/°C' | '%/K' | '%/°C';
  rthUnit: 'K/W' | '°C/W';
  derating: boolean;
  maxRatings: 'once' | 'per-series' | 'per-package';
  ratingsForm: 'table' | 'list' | 'sentence';
  series: 1 | 2;
  tolerance: 'min-max' | 'suffix-legend';
  orderingCodes: boolean;
  orientation: 'portrait' | 'rotated';
  pageColumns: 1 | 2;
  ruled: boolean;
  placement: 'line' | 'word' | 'glyph';
  pageBreak: 'none' | 'repeat-header' | 'no-repeat';
  clutter: Array<'prose' | 'curves' | 'outline' | 'example'>;
  vocabulary: Record<'vz' | 'izt' | 'zzt' | 'izk' | 'zzk' | 'ir' | 'vr' | 'tc' | 'izm' | 'pd' | 'tj' | 'rth', { symbol: string; name: string }>;
  qualifiers: 'lower' | 'dot' | 'words';
  unitBrackets: '()' | '[]';
  /** Image-only pages made by a rasteriser (only when one is passed; never drawn at random). */
  imageOnly?: boolean;
}

export interface RandomAnswerKey {
  file: string;
  vendor: string;
  title: string;
  layout: string;
  pages: number;
  seed: number;
  variants: Array<{ mpn: string; package: { value: string; page: number }; fields: Partial<Record<RatingField, RandomAnswerValue>> }>;
  choices: LayoutChoices;
}

/** One invented datasheet of random layout with its answer key; the same seed gives the same bytes. */
/**
 * `overrides` pins some choices; the rest and all values still come from the seed.
 * `rasterise` turns the PDF into an image-only one page for page (e.g. the OCR work's
 * scripts/lib/raster.ts); the answer key stays valid.
 */
export declare function generateRandomDatasheet(
  seed: number,
  overrides?: Partial<LayoutChoices>,
  options?: { rasterise?: (pdf: Buffer, seed: number) => Promise<Buffer> },
): Promise<{ pdf: Buffer; answers: RandomAnswerKey; choices: LayoutChoices }>;

/** "name=value" labels of a choice set (one per choice; vocabulary and clutter per item), for scoring per choice. */
export declare function layoutChoiceLabels(choices: LayoutChoices): string[];

/** A scanned copy of a fixture datasheet: every page an image, the original's answer key page for page. */
export interface ScannedFixture {
  name: string;
  pdfPath: string;
  original: DatasheetFixture;
}

export declare function listScannedFixtures(): ScannedFixture[];
