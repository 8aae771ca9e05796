import type { ExtractedVariant } from '../datasheets/extraction.schema';
import { kindOfUnit, normaliseQuantityText } from '../units/parse';
import type { RatingCardFieldsInput } from './rating-card.schema';

/**
 * A card draft from an extracted variant: every value the extraction found, marked
 * `extracted` with its datasheet, page and text, to be accepted or corrected by an
 * engineer. Fields it did not find stay absent. The temperature coefficient keeps the
 * unit the datasheet printed (%/K stays %/K; mV/°C, mV/K and V/K become mV/K).
 */
export function cardDraftFromExtraction(variant: ExtractedVariant, datasheetId: number): Partial<RatingCardFieldsInput> {
  const draft: Record<string, unknown> = {};
  for (const [field, found] of Object.entries(variant.fields)) {
    if (!found) continue;
    const printed = `${found.value} ${found.unit}`.trim();
    const provenance = { source: 'extracted' as const, datasheetId, page: found.page, text: found.text.slice(0, 500) };
    if (field === 'tc') {
      const percent = kindOfUnit(found.unit) === 'tempCoPercent';
      // The printed figure may use a decimal comma ("−0,058"); extraction keeps it as printed.
      const value = percent ? Number(normaliseQuantityText(found.value).replace(',', '.')) : Number((found.si * 1e3).toPrecision(12));
      if (!Number.isFinite(value)) continue;
      draft.tc = { value, unit: percent ? '%/K' : 'mV/K', printed, provenance };
    } else {
      draft[field] = { value: found.si, printed, provenance };
    }
  }
  return draft as Partial<RatingCardFieldsInput>;
}
