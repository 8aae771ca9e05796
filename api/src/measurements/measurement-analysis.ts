import {
  formatQuantity,
  MEASURED_CHECK_LABELS,
  type EngineeringCardInput,
  type LotResult,
  type MeasuredCheck,
  type MeasuredCheckId,
  type MeasuredSample,
  type MeasurementAnalysis,
  type SampleResult,
  type Spec,
} from '@shuntwise/contracts';
import { diodeVoltage, dynamicImpedance, fitBreakdownModel } from '../engineering/breakdown-model';
import { EngineeringInputError } from '../engineering/engineering-input.error';
import { DESIGN_CAUTION } from '../engineering/caution';
import { fitMeasuredSample, MeasuredFitError, spreadOf } from '../engineering/measured-fit';
import { T_REF_C } from '../engineering/physics';
import { overallVerdict, verdictOfMargin } from '../qualifications/evaluation/evaluate';

export interface MeasurementAnalysisInput {
  samples: readonly MeasuredSample[];
  /** The vendor part's current card as the core reads it; null without one (no vzNom/izt). */
  card: EngineeringCardInput | null;
  cardVersion: number | null;
  /** A house part's spec to hold the samples against; null to compare with the card only. */
  spec: { housePartId: number; version: number; spec: Spec } | null;
}

/** Marginal band (%) when no spec says otherwise; a spec brings its own. */
const DEFAULT_BAND_PERCENT = 5;

/**
 * Each sample's fitted breakdown curve read at the card's and the spec's currents, the spread
 * per lot, and every sample held against the datasheet's printed limits and the spec's windows.
 * Pure: samples, card and spec in; figures, verdicts and stated assumptions out.
 */
export function analyseMeasurements(input: MeasurementAnalysisInput): MeasurementAnalysis {
  const { card, spec } = input;
  const assumptions: string[] = [];
  const warnings: string[] = [];
  const iRef = card?.izt ?? spec?.spec.iRef ?? null;
  const kneeCurrent = card?.izk ?? spec?.spec.knee?.iKnee ?? null;
  if (iRef === null) warnings.push('no card and no spec: the samples are fitted, but there is no test current to read them at');
  const alphaFallback = card?.tc ?? null;

  const samples: SampleResult[] = input.samples.map((sample) => {
    const temperatures = [...new Set(sample.points.map((p) => p.tempC))];
    const empty: SampleResult = {
      sampleId: sample.sampleId,
      lot: sample.lot,
      points: sample.points.length,
      temperaturesC: temperatures,
      model: null,
      residualRms: null,
      currentRange: null,
      vzAtIzt: null,
      vzAtIRef: null,
      zdAtIzt: null,
      zdAtIRef: null,
      zdAtKnee: null,
      alphaVz: null,
      warnings: [],
      error: null,
    };
    if (iRef === null) return { ...empty, error: 'no test current to state the fit at' };
    try {
      const fit = fitMeasuredSample(sample.points, { referenceCurrent: iRef, alphaVzFallback: alphaFallback });
      const m = fit.model;
      const inside = (i: number) => i >= fit.currentMin / 1.5 && i <= fit.currentMax * 1.5;
      const sampleWarnings = [...fit.warnings];
      const at = (i: number | null, read: (i: number) => number, name: string): number | null => {
        if (i === null) return null;
        if (!inside(i)) {
          sampleWarnings.push(`${name} (${amps(i)}) is outside the measured currents ${amps(fit.currentMin)} … ${amps(fit.currentMax)}: not read`);
          return null;
        }
        return read(i);
      };
      return {
        ...empty,
        model: {
          bv: m.bv,
          ibv: m.ibv,
          nbv: m.nbv,
          rs: m.rs,
          nbvVt: m.nbvVt,
          alphaVz: fit.alphaFitted ? m.alphaVz : null,
          basis: 'measured',
          assumptions: fit.assumptions,
        },
        residualRms: fit.residualRms,
        currentRange: { min: fit.currentMin, max: fit.currentMax },
        vzAtIzt: card ? at(card.izt, (i) => diodeVoltage(m, i, T_REF_C), 'the card’s izt') : null,
        vzAtIRef: spec ? at(spec.spec.iRef, (i) => diodeVoltage(m, i, T_REF_C), 'the spec’s iRef') : null,
        zdAtIzt: card ? at(card.izt, (i) => dynamicImpedance(m, i), 'the card’s izt') : null,
        zdAtIRef: spec ? at(spec.spec.iRef, (i) => dynamicImpedance(m, i), 'the spec’s iRef') : null,
        zdAtKnee: at(kneeCurrent, (i) => dynamicImpedance(m, i), 'the knee current'),
        alphaVz: fit.alphaFitted ? m.alphaVz : null,
        warnings: sampleWarnings,
      };
    } catch (error) {
      if (error instanceof MeasuredFitError) return { ...empty, error: error.message };
      throw error;
    }
  });
  const failedFits = samples.filter((s) => s.error !== null);
  if (failedFits.length > 0)
    warnings.push(`${failedFits.length} of ${samples.length} sample(s) could not be fitted: ${failedFits.map((s) => `${s.sampleId} (${s.error})`).join('; ')}`);
  assumptions.push('each sample: V(I) = BV + NBV·Vt·ln(I/IBV) + RS·I fitted by least squares; figures read from the fit at 25 °C');

  const lots = lotsOf(samples);
  const band = spec?.spec.marginalBandPercent ?? DEFAULT_BAND_PERCENT;
  const checks: MeasuredCheck[] = [];
  if (card) {
    if (card.vzMin != null && card.vzMax != null)
      checks.push(windowCheck('card-vz', 'card', samples, (s) => s.vzAtIzt, card.vzMin, card.vzMax, band, amps(card.izt)));
    if (card.zzt != null) checks.push(maxCheck('card-zzt', 'card', samples, (s) => s.zdAtIzt, card.zzt, band, amps(card.izt)));
    if (card.zzk != null && card.izk != null) checks.push(maxCheck('card-zzk', 'card', samples, (s) => s.zdAtKnee, card.zzk, band, amps(card.izk)));
  }
  if (spec) {
    const s = spec.spec;
    checks.push(windowCheck('spec-vz', 'spec', samples, (x) => x.vzAtIRef, s.vz.min, s.vz.max, band, amps(s.iRef)));
    if (s.zdMax !== null) checks.push(maxCheck('spec-zd', 'spec', samples, (x) => x.zdAtIRef, s.zdMax, band, amps(s.iRef)));
  }
  return {
    datasheetBand: card ? datasheetBand(card, samples, warnings) : [],
    cardVersion: input.cardVersion,
    housePartId: spec?.housePartId ?? null,
    specVersion: spec?.version ?? null,
    referenceCurrent: iRef,
    samples,
    lots,
    checks,
    overall: checks.length === 0 ? 'no-data' : overallVerdict(checks),
    assumptions,
    warnings,
    caution: DESIGN_CAUTION,
  };
}

/** The card's curve at its tolerance ends over the measured currents (40 log-spaced points). */
function datasheetBand(card: EngineeringCardInput, samples: SampleResult[], warnings: string[]): MeasurementAnalysis['datasheetBand'] {
  const ranges = samples.map((s) => s.currentRange).filter((r): r is { min: number; max: number } => r !== null);
  const lo = ranges.length ? Math.min(...ranges.map((r) => r.min)) : (card.izk ?? card.izt / 10);
  const hi = ranges.length ? Math.max(...ranges.map((r) => r.max)) : card.izt * 4;
  try {
    const model = fitBreakdownModel(card);
    return Array.from({ length: 40 }, (_, k) => {
      const current = lo * (hi / lo) ** (k / 39);
      return {
        current,
        low: diodeVoltage(model, current, T_REF_C, 'min'),
        nom: diodeVoltage(model, current, T_REF_C, 'nom'),
        high: diodeVoltage(model, current, T_REF_C, 'max'),
      };
    });
  } catch (error) {
    if (!(error instanceof EngineeringInputError)) throw error;
    warnings.push(`the card cannot be drawn as a band: ${error.message}`);
    return [];
  }
}

function lotsOf(samples: SampleResult[]): LotResult[] {
  const byLot = new Map<string | null, SampleResult[]>();
  for (const s of samples) byLot.set(s.lot, [...(byLot.get(s.lot) ?? []), s]);
  const lotResult = (lot: string | null, list: SampleResult[]): LotResult => {
    const figures = (pick: (s: SampleResult) => number | null) => spreadOf(list.map(pick).filter((v): v is number => v !== null));
    return {
      lot,
      samples: list.length,
      vzAtIzt: figures((s) => s.vzAtIzt),
      vzAtIRef: figures((s) => s.vzAtIRef),
      zdAtIzt: figures((s) => s.zdAtIzt),
      zdAtKnee: figures((s) => s.zdAtKnee),
    };
  };
  const lots = [...byLot.entries()].map(([lot, list]) => lotResult(lot, list));
  if (byLot.size > 1) lots.push(lotResult(null, samples));
  return lots;
}

function windowCheck(
  id: MeasuredCheckId,
  against: 'card' | 'spec',
  samples: SampleResult[],
  pick: (s: SampleResult) => number | null,
  min: number,
  max: number,
  band: number,
  at: string,
): MeasuredCheck {
  const base = { id, label: MEASURED_CHECK_LABELS[id], against, quantity: 'voltage' as const, limitKind: 'window' as const, window: { min, max } };
  const read = samples.map((s) => ({ s, v: pick(s) })).filter((x): x is { s: SampleResult; v: number } => x.v !== null);
  if (read.length === 0)
    return { ...base, verdict: 'no-data', value: null, limit: null, margin: null, failingSamples: [], detail: `no sample could be read at ${at}` };
  let worst = { margin: Infinity, value: 0, limit: 0 };
  for (const { v } of read) {
    const low = percent(v - min, min);
    const high = percent(max - v, max);
    const m = Math.min(low, high);
    if (m < worst.margin) worst = { margin: m, value: v, limit: low <= high ? min : max };
  }
  const failing = read.filter(({ v }) => v < min || v > max).map(({ s }) => s.sampleId);
  const values = read.map((x) => x.v);
  return {
    ...base,
    verdict: read.length < samples.length && failing.length === 0 ? 'no-data' : verdictOfMargin(worst.margin, band),
    value: worst.value,
    limit: worst.limit,
    margin: worst.margin,
    failingSamples: failing,
    detail: `${read.length} sample(s) at ${at}, 25 °C: ${volts(Math.min(...values))} … ${volts(Math.max(...values))} against ${volts(min)} … ${volts(max)}${failing.length ? `; outside: ${failing.join(', ')}` : ''}${read.length < samples.length ? `; ${samples.length - read.length} sample(s) not read` : ''}`,
  };
}

function maxCheck(
  id: MeasuredCheckId,
  against: 'card' | 'spec',
  samples: SampleResult[],
  pick: (s: SampleResult) => number | null,
  limit: number,
  band: number,
  at: string,
): MeasuredCheck {
  const base = { id, label: MEASURED_CHECK_LABELS[id], against, quantity: 'resistance' as const, limitKind: 'max' as const, window: null, limit };
  const read = samples.map((s) => ({ s, v: pick(s) })).filter((x): x is { s: SampleResult; v: number } => x.v !== null);
  if (read.length === 0) return { ...base, verdict: 'no-data', value: null, margin: null, failingSamples: [], detail: `no sample could be read at ${at}` };
  const highest = Math.max(...read.map((x) => x.v));
  const margin = percent(limit - highest, limit);
  const failing = read.filter(({ v }) => v > limit).map(({ s }) => s.sampleId);
  return {
    ...base,
    verdict: read.length < samples.length && failing.length === 0 ? 'no-data' : verdictOfMargin(margin, band),
    value: highest,
    margin,
    failingSamples: failing,
    detail: `highest Zd of ${read.length} sample(s) at ${at}: ${ohms(highest)} against at most ${ohms(limit)}${failing.length ? `; above: ${failing.join(', ')}` : ''}`,
  };
}

function percent(difference: number, reference: number): number {
  const p = (difference / Math.abs(reference)) * 100;
  return Math.abs(p) < 1e-9 ? 0 : p;
}

const amps = (x: number) => formatQuantity(x, 'current');
const volts = (x: number) => formatQuantity(x, 'voltage');
const ohms = (x: number) => formatQuantity(x, 'resistance');
