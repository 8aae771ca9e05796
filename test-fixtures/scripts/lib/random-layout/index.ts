import { Prng } from '../prng';
import { Field } from '../types';
import { leaderLists, paramTables, partPerPage, rowsTable, sentences, transposedTable } from './arrangements';
import { ARRANGEMENTS, drawChoices, LayoutChoices, normaliseChoices, vendorName } from './choices';
import { byPackage, clutterBlocks, cover, Ctx, legendBlock, markerStyle, orderingBlock, ratingsBlock } from './common';
import { buildModel, SeriesModel } from './model';
import { Flow, Pen } from './pen';

/**
 * Datasheets of random layout with their answer keys, for measuring extraction on layouts
 * nobody wrote a rule for. One seed gives one document, byte for byte the same each time.
 * Vendors and part numbers are random syllables and letters: invented, like all values.
 */

export type { LayoutChoices } from './choices';
export { ARRANGEMENTS, choiceLabels } from './choices';

/** A value as printed, its SI value, its page; `derived` when it is not printed as such. */
export interface RandomAnswerValue {
  value: string;
  unit: string;
  si: number;
  page: number;
  derived?: 'tolerance-suffix';
}

export interface RandomAnswerVariant {
  mpn: string;
  package: { value: string; page: number };
  fields: Partial<Record<Field, RandomAnswerValue>>;
}

/** The shape of the fixture answer keys, plus the layout choices the document was drawn with. */
export interface RandomAnswerKey {
  file: string;
  vendor: string;
  title: string;
  layout: string;
  pages: number;
  seed: number;
  variants: RandomAnswerVariant[];
  choices: LayoutChoices;
}

export interface RandomDatasheet {
  /** The PDF (image-only when a rasteriser was given). */
  pdf: Buffer;
  answers: RandomAnswerKey;
  choices: LayoutChoices;
}

type Arranger = (ctx: Ctx, flow: Flow, s: SeriesModel) => void;
const ARRANGE: Record<(typeof ARRANGEMENTS)[number], Arranger> = {
  rows: rowsTable,
  transposed: transposedTable,
  'part-per-page': partPerPage,
  'leader-list': leaderLists,
  'param-table': paramTables,
  sentences,
};

/** Turns a text PDF into an image-only one, page for page (the OCR work's rasteriser, scripts/lib/raster.ts). */
export type Rasteriser = (pdf: Buffer, seed: number) => Promise<Buffer>;

/**
 * One random datasheet. `overrides` pins some choices (to look at one layout family); the
 * other choices and all values are still drawn from the seed. With `rasterise` the document
 * becomes image-only (a scan); the answer key stays valid page for page.
 */
export async function generateRandomDatasheet(
  seed: number,
  overrides: Partial<LayoutChoices> = {},
  options: { rasterise?: Rasteriser } = {},
): Promise<RandomDatasheet> {
  const prng = new Prng(seed);
  const drawn = { ...drawChoices(prng), ...overrides };
  const vendor = vendorName(prng);
  const model = buildModel(prng, drawn, vendor);
  const c = normaliseChoices(drawn);
  const pen = new Pen(c, { vendor, title: model.title, docId: model.docId, revision: prng.pick(['A', 'B', 'C', '2', '3']) });
  const ctx: Ctx = { pen, prng, model, marker: markerStyle(prng) };
  const flow = new Flow(pen, c.pageColumns);
  const rotated = c.orientation === 'rotated';

  cover(ctx, flow);
  flow.nextColumn();
  if (c.maxRatings === 'once') ratingsBlock(ctx, flow, 'Absolute maximum ratings', model.packages[0], model.parts);
  if (c.clutter.includes('prose')) clutterBlocks(ctx, flow, ['prose']);

  for (const s of model.series) {
    if (c.maxRatings === 'per-series') {
      flow.need(140);
      ratingsBlock(ctx, flow, `Maximum ratings, ${s.name} series (${s.packages[0].name})`, s.packages[0], s.rows.flat());
    }
    if (rotated && c.arrangement !== 'rows' && c.arrangement !== 'transposed' && c.arrangement !== 'part-per-page') flow.newPage(true);
    else if (c.arrangement !== 'rows' && c.arrangement !== 'transposed' && c.arrangement !== 'part-per-page') flow.need(200);
    ARRANGE[c.arrangement](ctx, flow, s);
    legendBlock(ctx, flow, s);
  }
  if (c.maxRatings === 'per-package') {
    flow.newPage(false);
    for (const [pkg, parts] of byPackage(model)) ratingsBlock(ctx, flow, `Maximum ratings, ${pkg.name} package`, pkg, parts);
  }
  if (c.orderingCodes) orderingBlock(ctx, flow);
  clutterBlocks(ctx, flow, ['example', 'curves', 'outline']);
  pen.close();
  const text = await pen.sheet.finish();
  const pdf = options.rasterise ? await options.rasterise(text, seed) : text;
  const pages = pen.page;

  const variants: RandomAnswerVariant[] = model.parts.map((p) => {
    const a = pen.answers.get(p.mpn);
    if (!a || a.package.page === 0) throw new Error(`seed ${seed}: ${p.mpn} has no package recorded (generator bug)`);
    for (const f of Object.keys(p.values) as Field[]) {
      if (!a.fields[f]) throw new Error(`seed ${seed}: ${p.mpn} ${f} was never printed (generator bug)`);
    }
    return { mpn: p.mpn, package: a.package, fields: a.fields };
  });
  for (const p of model.parts) {
    for (const f of ['pdMax', 'tjMax', 'rthJA'] as const) if (!pen.answers.get(p.mpn)!.fields[f]) throw new Error(`seed ${seed}: ${p.mpn} ${f} missing`);
  }
  const layout = `${options.rasterise ? 'image-only; ' : ''}${c.arrangement}; units ${c.units}; conditions ${c.conditions}; decimal ${c.decimal}; ratings ${c.maxRatings} as ${c.ratingsForm}`;
  const file = `random-${seed}.pdf`;
  const choices: LayoutChoices = { ...c, imageOnly: Boolean(options.rasterise) };
  return { pdf, answers: { file, vendor, title: model.title, layout, pages, seed, variants, choices }, choices };
}
