import { Readable } from 'node:stream';
import { Injectable } from '@nestjs/common';
import {
  CARD_FIELD_KINDS,
  CARD_FIELD_WORDS,
  CARD_FIELDS,
  roundToStated,
  SI_UNIT,
  type PlainCardField,
  type RatingCardFields,
  type TcValue,
} from '@shuntwise/contracts';
import { HousePartsRepository } from '../house-parts/house-parts.repository';
import { RatingCardsRepository, type CardExportRow } from '../vendor-parts/rating-cards.repository';
import { csvExportStringifier } from '../common/csv/csv-export';

const BATCH = 1000;

/** Units in export headers: SI, spelled so a spreadsheet and our own import read them back (ohm, not Ω). */
const HEADER_UNIT: Record<string, string> = { resistance: 'ohm' };
const unitOf = (field: PlainCardField) => HEADER_UNIT[CARD_FIELD_KINDS[field]] ?? SI_UNIT[CARD_FIELD_KINDS[field]];

/**
 * The card export's columns, in words with their units ("Zener voltage nominal (V)"); the
 * coefficient keeps its own unit in each cell, as the card holds it. The series import reads
 * these headers back (and the short names older exports wrote).
 */
export const CARD_EXPORT_HEADER = [
  'Manufacturer',
  'Manufacturer part number',
  'Package',
  'Lifecycle note',
  'Card version',
  ...CARD_FIELDS.map((f) => (f === 'tc' ? CARD_FIELD_WORDS.tc : `${CARD_FIELD_WORDS[f]} (${unitOf(f)})`)),
  `${CARD_FIELD_WORDS.tc} converted (V/K)`,
  'Unconfirmed fields',
];

/** The house-part export's columns, in words (nothing imports this file). */
export const HOUSE_PART_EXPORT_HEADER = [
  'House part',
  'Description',
  'Status',
  'Spec version',
  'Source role',
  'Manufacturer',
  'Manufacturer part number',
  'Package',
  'Lifecycle note',
  'Card version',
  'Source note',
  'Source since',
];

/** CSV exports, `text/csv` with a BOM so spreadsheets read the UTF-8 (µ, °, Ω) right. */
@Injectable()
export class CatalogueExportService {
  constructor(
    private readonly cards: RatingCardsRepository,
    private readonly parts: HousePartsRepository,
  ) {}

  /** Every card, SI values with the unit in the header (tc with its own unit in the cell): importable again as is. */
  ratingCards(manufacturer?: string): Readable {
    const cards = this.cards;
    async function* rows() {
      yield CARD_EXPORT_HEADER;
      let after = 0;
      for (;;) {
        const batch = await cards.exportBatch(after, BATCH, manufacturer);
        for (const row of batch) yield cardRow(row);
        if (batch.length < BATCH) return;
        after = batch[batch.length - 1].vendorPartId;
      }
    }
    return Readable.from(rows()).pipe(csvExportStringifier());
  }

  /** One row per source of every house part (a house part without sources gets one row of its own). */
  async houseParts(): Promise<Readable> {
    const [parts, sources] = await Promise.all([this.parts.listAll(), this.parts.listAllSources()]);
    const byPart = new Map<number, typeof sources>();
    for (const s of sources) byPart.set(s.housePartId, [...(byPart.get(s.housePartId) ?? []), s]);
    const header = HOUSE_PART_EXPORT_HEADER;
    const rows: unknown[][] = [[...header]];
    for (const p of parts) {
      const own = [p.partNumber, p.description, p.status, p.specVersion ?? ''];
      const list = byPart.get(p.id) ?? [];
      if (list.length === 0) rows.push([...own, '', '', '', '', '', '', '', '']);
      for (const s of list) {
        rows.push([
          ...own,
          s.role,
          s.manufacturer,
          s.mpn,
          s.package ?? '',
          s.lifecycleNote ?? '',
          s.cardVersion ?? '',
          s.note ?? '',
          new Date(s.createdAt).toISOString().slice(0, 10),
        ]);
      }
    }
    return Readable.from(rows).pipe(csvExportStringifier());
  }
}

function cardRow(row: CardExportRow): unknown[] {
  const f: RatingCardFields = row.fields;
  const tc = f.tc as TcValue | undefined;
  return [
    row.manufacturer,
    row.mpn,
    row.package ?? '',
    row.lifecycleNote ?? '',
    row.version,
    ...CARD_FIELDS.map((field) => {
      const v = f[field];
      if (!v) return '';
      // Rounded to the figures the datasheet text states: no binary noise such as 0.00025000000000000006.
      if (field === 'tc') return `${roundToStated((v as TcValue).value, v.printed)} ${(v as TcValue).unit}`;
      return roundToStated(v.value, v.printed);
    }),
    tc ? roundToStated(tc.voltsPerKelvin, tc.printed) : '',
    CARD_FIELDS.filter((field) => f[field] && !f[field]!.provenance.confirmedBy)
      .map((field) => CARD_FIELD_WORDS[field])
      .join('; '),
  ];
}

/** `shuntwise-<what>-YYYY-MM-DD.csv` */
export function exportFileName(what: string, now = new Date()): string {
  return `shuntwise-${what}-${now.toISOString().slice(0, 10)}.csv`;
}
