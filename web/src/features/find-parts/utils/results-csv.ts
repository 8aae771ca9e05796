import { CARD_FIELD_WORDS, CLEARANCE_STANDING_LABELS, roundToDigits, type RegulatorResponse, type SearchItem } from '@shuntwise/contracts';
import { toCsv, type CsvCell } from '@/lib/csv';
import { VERDICT_TITLE } from './circuit';

/** The CSV's columns: words with the unit the numbers are in (SI, as the API sends them). */
export const RESULT_COLUMNS = [
  'Part number',
  'Manufacturer',
  'Package',
  `${CARD_FIELD_WORDS.vzMin} (V)`,
  `${CARD_FIELD_WORDS.vzNom} (V)`,
  `${CARD_FIELD_WORDS.vzMax} (V)`,
  `${CARD_FIELD_WORDS.izt} (A)`,
  'Tolerance (%)',
  `${CARD_FIELD_WORDS.zzt} (Ω)`,
  `${CARD_FIELD_WORDS.pdMax} (W)`,
  `${CARD_FIELD_WORDS.tc} (V/K)`,
  'May be designed in for',
] as const;

/** Added when the circuit check ran: its answer for each part it was run on. */
export const CHECK_COLUMNS = [
  'Circuit check',
  'Chosen resistor (Ω)',
  'Resistor series',
  'Working range from (Ω)',
  'Working range to (Ω)',
  'Output lowest (V)',
  'Output highest (V)',
  'Diode power worst corner (W)',
  'Diode power allowed (W)',
  'Resistor power worst corner (W)',
] as const;

const r3 = (x: number | null | undefined) => roundToDigits(x, 3);

function clearances(item: SearchItem): string {
  if (!item.cleared) return 'not cleared';
  return item.clearances
    .map((c) => `${c.housePart.partNumber}: ${CLEARANCE_STANDING_LABELS[c.standing]}${c.conditions ? ` (${c.conditions})` : ''}`)
    .join('; ');
}

function checkCells(result: RegulatorResponse | undefined): CsvCell[] {
  if (!result) return CHECK_COLUMNS.map(() => null);
  return [
    VERDICT_TITLE[result.verdict],
    r3(result.selected?.resistance),
    result.selected?.series ?? null,
    r3(result.range.min),
    r3(result.range.max),
    roundToDigits(result.outputBand?.vMin, 4),
    roundToDigits(result.outputBand?.vMax, 4),
    r3(result.diodePower),
    r3(result.diodePowerAllowed),
    r3(result.resistorPower),
  ];
}

/**
 * The results as a designer takes them away: one row per part with the figures the table
 * shows, rounded as printed; with the circuit check's columns when a check ran (filled for
 * the parts it ran on).
 */
export function resultsCsv(items: readonly SearchItem[], checks?: ReadonlyMap<number, RegulatorResponse>): string {
  const withChecks = checks !== undefined && checks.size > 0;
  const rows = items.map((item) => {
    const card = item.card;
    const row: CsvCell[] = [
      item.vendorPart.mpn,
      item.vendorPart.manufacturer,
      item.vendorPart.package,
      // Zener voltages keep a fourth figure: 10.45 V is a datasheet value, not 10.4 V.
      roundToDigits(card?.vzMin, 4),
      roundToDigits(card?.vzNom, 4),
      roundToDigits(card?.vzMax, 4),
      r3(card?.izt),
      card?.tolerance != null ? roundToDigits(card.tolerance * 100, 2) : null,
      r3(card?.zzt),
      r3(card?.pdMax),
      r3(card?.tc),
      clearances(item),
    ];
    if (withChecks) row.push(...checkCells(checks.get(item.vendorPart.id)));
    return row;
  });
  return toCsv(withChecks ? [...RESULT_COLUMNS, ...CHECK_COLUMNS] : [...RESULT_COLUMNS], rows);
}
