import { createHash } from 'node:crypto';
import { toEngineeringCard, type AuditEntry, type Evaluation, type MeasurementAnalysis, type RatingCardFields, type Spec } from '@shuntwise/contracts';
import { diodeVoltage, fitBreakdownModel } from '../../engineering/breakdown-model';
import { T_REF_C } from '../../engineering/physics';
import { currentGrid } from '../evaluation/compare-curves';

/**
 * Everything a decision record is drawn from, frozen when the case is decided. The PDF is a
 * pure function of this (record-pdf.ts); its canonical JSON is stored with the record row and
 * its sha256 printed on every record, so a record can be re-drawn and checked byte for byte.
 * Bump `format` when the shape or the drawing changes: records already stored keep theirs.
 */
export interface RecordInputs {
  format: 1;
  /** When the record was made: the decision time, or later for a case decided before records existed. */
  madeAt: string;
  case: {
    id: number;
    revision: number;
    previousId: number | null;
    state: string;
    stateLabel: string;
    overall: string;
    summary: string;
    openedAt: string;
    submittedAt: string | null;
    preparedBy: { id: number; name: string };
    reviewer: { id: number; name: string } | null;
    decision: { state: string; stateLabel: string; at: string; by: { id: number; name: string }; text: string | null } | null;
    revocation: { at: string; by: { id: number; name: string }; reason: string } | null;
  };
  housePart: { id: number; partNumber: string; description: string; specVersion: number; spec: Spec | null };
  vendorPart: {
    id: number;
    manufacturer: string;
    mpn: string;
    package: string | null;
    cardVersion: number;
    card: RatingCardFields | null;
    cardNote: string | null;
  };
  /** The datasheets the card's values cite. */
  datasheets: Array<{ id: number; fileName: string; revision: string | null; sha256: string; pages: number }>;
  evaluation: Evaluation;
  measurementSets: Array<{
    id: number;
    fileName: string;
    sha256: string;
    sizeBytes: number;
    lot: string | null;
    instrument: string | null;
    measuredOn: string | null;
    uploadedAt: string;
    samples: number;
    points: number;
    analysis: Pick<MeasurementAnalysis, 'overall' | 'checks' | 'cardVersion' | 'specVersion' | 'warnings'>;
  }>;
  /** The card's I–V curve at 25 °C (nominal and tolerance ends), or why there is none. */
  curve: {
    tempC: number;
    points: Array<{ current: number; low: number; nom: number; high: number }>;
    iRef: number | null;
    window: { min: number; max: number } | null;
  } | null;
  curveNote: string | null;
  comments: Array<{ at: string; by: string; text: string }>;
  audit: Array<Pick<AuditEntry, 'at' | 'action' | 'fromState' | 'toState' | 'note' | 'changes'> & { by: string | null }>;
  caution: string;
}

/**
 * Canonical JSON: object keys sorted by code unit, no white space, numbers as JavaScript
 * prints them (the rules of RFC 8785 for the values a snapshot holds). Refuses what JSON
 * cannot say exactly (NaN, ±Infinity, undefined inside arrays) instead of writing null.
 */
export function canonicalJson(value: unknown): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value)) throw new Error(`canonical JSON cannot hold ${value}`);
      return JSON.stringify(value);
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'object': {
      if (Array.isArray(value)) {
        return `[${value
          .map((v) => {
            if (v === undefined) throw new Error('canonical JSON cannot hold undefined in an array');
            return canonicalJson(v);
          })
          .join(',')}]`;
      }
      const entries = Object.entries(value as Record<string, unknown>)
        .filter(([, v]) => v !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
      return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
    }
    default:
      throw new Error(`canonical JSON cannot hold a ${typeof value}`);
  }
}

export function sha256Hex(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

/**
 * The card's curve at a junction of 25 °C from the engineering core: nominal and the
 * tolerance ends over the spec's currents (the Compare chart's grid), with the spec's
 * window at its reference current to draw against. Null with a reason when the card
 * cannot be fitted.
 */
export function recordCurve(card: RatingCardFields | null, spec: Spec | null): { curve: RecordInputs['curve']; note: string | null } {
  const engineering = card ? toEngineeringCard(card) : null;
  if (!engineering) return { curve: null, note: 'The card has no Zener voltage at a test current: no curve.' };
  try {
    const model = fitBreakdownModel(engineering);
    const currents = spec ? currentGrid(spec) : logGrid(model.lowestTestCurrent / 2, model.izt * 4, 41);
    const points = currents.map((current) => ({
      current,
      low: diodeVoltage(model, current, T_REF_C, 'min'),
      nom: diodeVoltage(model, current, T_REF_C, 'nom'),
      high: diodeVoltage(model, current, T_REF_C, 'max'),
    }));
    if (points.some((p) => !Number.isFinite(p.low) || !Number.isFinite(p.nom) || !Number.isFinite(p.high))) {
      return { curve: null, note: 'The fitted model gives no finite voltage over these currents: no curve.' };
    }
    return {
      curve: { tempC: T_REF_C, points, iRef: spec?.iRef ?? null, window: spec ? { min: spec.vz.min, max: spec.vz.max } : null },
      note: model.warnings.length ? model.warnings.join(' ') : null,
    };
  } catch (error) {
    return { curve: null, note: `No curve: ${(error as Error).message}` };
  }
}

function logGrid(lo: number, hi: number, n: number): number[] {
  const step = Math.log(hi / lo) / (n - 1);
  return Array.from({ length: n }, (_, k) => (k === n - 1 ? hi : lo * Math.exp(step * k)));
}
