import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { normalizeBasis, normalizeRequestFor, toEngineeringCard, type RatingCard, type TempCoUnit } from '@shuntwise/contracts';
import { draftFromCard, engineeringCardOf } from './card-draft';

/**
 * One value path: the numbers the card editor computes and shows and the numbers the
 * qualification evaluation judges come from the same function, contracts' toEngineeringCard.
 */
const ROOT = join(__dirname, '../../../../..');
const source = (path: string) => readFileSync(join(ROOT, path), 'utf8');

interface DemoField {
  value: number;
  printed: string;
  page: number;
  unit?: TempCoUnit;
  valueInUnit?: number;
}
interface DemoPart {
  mpn: string;
  ratingCard: { pdRefC: number; fields: Record<string, DemoField> };
}
const catalogue = JSON.parse(source('test-fixtures/catalogue/demo-catalogue.json')) as { vendorParts: DemoPart[] };

/** A demo card as GET …/rating-card returns it: SI values; tc as printed with its stored V/K. */
function storedCard(part: DemoPart): Pick<RatingCard, 'fields'> {
  const provenance = { source: 'extracted' as const, datasheetId: 1, page: 2, text: null, confirmedBy: null, confirmedAt: null };
  const fields: Record<string, unknown> = {};
  const all: Record<string, DemoField> = {
    ...part.ratingCard.fields,
    pdRefC: { value: part.ratingCard.pdRefC, printed: `${part.ratingCard.pdRefC} °C`, page: 1 },
  };
  for (const [field, f] of Object.entries(all)) {
    fields[field] =
      field === 'tc'
        ? // The generator's own V/K (test-fixtures/scripts), not this project's conversion.
          { value: f.valueInUnit, unit: f.unit, voltsPerKelvin: f.value, printed: f.printed, provenance }
        : { value: f.value, printed: f.printed, provenance };
  }
  return { fields: fields as RatingCard['fields'] };
}

describe('the card editor and the evaluation read a card through one mapping', () => {
  it('every call site that turns a card into engineering input imports contracts’ toEngineeringCard', () => {
    const callSites = {
      'api/src/qualifications/qualifications.service.ts': /card: toEngineeringCard\(basis\.vendorPart\.fields\)/, // the evaluation's input
      'api/src/vendor-parts/rating-cards.service.ts': /toEngineeringCard\(card\.fields\)/, // the card read (include=engineering, .model)
      'api/src/search/search.service.ts': /toEngineeringCard\(fields\)/, // search, and so the circuit check
      'web/src/features/vendor-parts/utils/card-draft.ts': /return toEngineeringCard\(valued\(draft\)\)/, // the editor's live reading
    };
    for (const [path, call] of Object.entries(callSites)) {
      const text = source(path);
      expect(text).toMatch(/import[^;]*\btoEngineeringCard\b[^;]*from '@shuntwise\/contracts'/s);
      expect(text).toMatch(call);
    }
    // The circuit check hands on search's card as it is, without reading fields anew.
    expect(source('web/src/features/find-parts/utils/circuit.ts')).toMatch(/const \{ version: _version, tolerance: _tolerance, \.\.\.engineering \} = card;/);
  });

  it('no code outside contracts converts a printed temperature coefficient to V/K', () => {
    // The only conversion is contracts' tcVoltsPerKelvin; the API calls it where a card is written and where extraction reads %/K.
    const callers = ['api/src/vendor-parts/rating-cards.service.ts', 'api/src/extraction/rating-extractor.ts'];
    for (const path of callers) expect(source(path)).toMatch(/tcVoltsPerKelvin\(/);
    for (const path of [
      'api/src/qualifications/evaluation/evaluate.ts',
      'api/src/engineering/breakdown-model.ts',
      'api/src/engineering/card-checks.ts',
      'api/src/measurements/measurement-analysis.ts',
      'web/src/features/find-parts/utils/circuit.ts',
      'web/src/features/vendor-parts/utils/card-draft.ts',
    ]) {
      const text = source(path);
      expect(text).not.toMatch(/\/ 100\) \* |tcToVoltsPerKelvin|tcVoltsPerKelvin\(/);
    }
  });

  const withPercent = catalogue.vendorParts.filter((p) => p.ratingCard.fields.tc?.unit === '%/K');
  const withMilli = catalogue.vendorParts.filter((p) => p.ratingCard.fields.tc?.unit === 'mV/K');

  it('the demo catalogue has cards with tc printed in %/K and in mV/K to check', () => {
    expect(withPercent.length).toBeGreaterThan(0);
    expect(withMilli.length).toBeGreaterThan(0);
  });

  it.each([...withPercent.slice(0, 6), ...withMilli.slice(0, 3)].map((p) => [p.mpn, p] as const))(
    '%s: the editor’s engineering card equals the evaluation’s, and both equal the generator’s SI values',
    (_mpn, part) => {
      const stored = storedCard(part);
      const evaluation = toEngineeringCard(stored.fields)!; // what evaluateCard is given
      const editor = engineeringCardOf(draftFromCard(stored))!; // what the editor posts to /engineering/normalize
      const { tc: editorTc, ...editorRest } = editor;
      const { tc: evaluationTc, ...evaluationRest } = evaluation;
      expect(editorRest).toEqual(evaluationRest);
      // The editor converts the printed tc with vzNom; the stored card carries the V/K the API computed at
      // the write. Against the fixture generator's V/K (test-fixtures/scripts, written apart from the app;
      // definition of a relative coefficient, common practice, no source): equal to 1e-12 relative.
      const generated = part.ratingCard.fields.tc.value;
      expect(Math.abs(editorTc! - generated)).toBeLessThanOrEqual(1e-12 * Math.abs(generated));
      expect(Math.abs(evaluationTc! - generated)).toBeLessThanOrEqual(1e-12 * Math.abs(generated));
      for (const [field, f] of Object.entries(part.ratingCard.fields)) {
        if (field !== 'tc') expect({ field, value: (evaluation as Record<string, unknown>)[field] }).toEqual({ field, value: f.value });
      }
      // And the normalisation the editor asks for is the one the card read computes.
      const basis = normalizeBasis(evaluation, null);
      expect(normalizeRequestFor({ ...editor, tc: evaluationTc }, normalizeBasis(editor, null))).toEqual(normalizeRequestFor(evaluation, basis));
    },
  );
});
