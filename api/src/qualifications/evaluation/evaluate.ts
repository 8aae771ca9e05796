import {
  CHECK_IDS,
  CHECK_LABELS,
  formatNumber,
  formatPercent,
  formatQuantity,
  QUALIFICATION_VERDICT_LABELS,
  type CheckId,
  type EngineeringCardInput,
  type Evaluation,
  type QualificationCheck,
  type QualificationVerdict,
  type SkippedCheck,
  type Spec,
  type VoltageWindow,
} from '@shuntwise/contracts';
import { diodeVoltage, dynamicImpedance, fitBreakdownModel, modelSummary, type BreakdownModel } from '../../engineering/breakdown-model';
import { checkCard } from '../../engineering/card-checks';
import { DESIGN_CAUTION } from '../../engineering/caution';
import { EngineeringInputError } from '../../engineering/engineering-input.error';
import { kneeReading } from '../../engineering/knee';
import { worstCaseWindow } from '../../engineering/envelope';
import { mechanismOf, mechanismSignWarning } from '../../engineering/mechanism';
import { T_REF_C } from '../../engineering/physics';
import { deratedPowerLimit, powerCheck } from '../../engineering/power';

const celsius = (x: number) => formatQuantity(x, 'temperature', { trim: true });

export interface EvaluationInput {
  spec: Spec;
  specVersion: number;
  /** The card as the core reads it; null when it lacks vzNom or izt. */
  card: EngineeringCardInput | null;
  cardVersion: number;
  /** The vendor part's package, as the catalogue holds it. */
  vendorPackage: string | null;
  now?: Date;
}

/** Relative float noise below which a margin counts as exactly zero (a value on its limit). */
const MARGIN_EPSILON = 1e-9;
/** A test voltage counts as "the spec's" within this relative difference (printed values are rounded). */
const VOLTAGE_MATCH = 1e-9;

const REF_CONDITIONS =
  'checks at reference conditions (window, Zd, knee, leakage) use Tj = 25 °C: datasheets state them at 25 °C with short test pulses, so the junction does not heat';

/**
 * Every check of a vendor part's card against a house part's spec, with its normalised
 * value, limit, margin (in % of the limit), verdict and assumptions. Pure: the numbers come
 * from the engineering core; nothing here touches the database.
 */
export function evaluateCard(input: EvaluationInput): Evaluation {
  const { spec, card } = input;
  const band = spec.marginalBandPercent;
  const checks: QualificationCheck[] = [];
  const notApplicable: SkippedCheck[] = [];
  const assumptions: string[] = [];
  const warnings: string[] = [];

  let model: BreakdownModel | null = null;
  let noCard: string | null = null;
  if (!card) noCard = 'the card needs VZ nom and IZT before anything can be computed';
  else {
    try {
      model = fitBreakdownModel(card);
    } catch (error) {
      if (!(error instanceof EngineeringInputError)) throw error;
      noCard = `the card contradicts itself: ${error.message}`;
    }
  }
  if (card && model) {
    assumptions.push(...model.assumptions, REF_CONDITIONS);
    for (const w of model.warnings) pushOnce(warnings, w);
    for (const issue of checkCard(card)) {
      if (issue.severity === 'warning' && !model.warnings.includes(issue.message)) pushOnce(warnings, `${issue.field}: ${issue.message}`);
    }
  } else if (noCard) warnings.push(noCard);

  let window: VoltageWindow | null = null;
  let windowFailure: string | null = null;
  if (model) {
    try {
      window = worstCaseWindow(model, spec.envelope, { selfHeating: true, includeTolerance: true });
    } catch {
      windowFailure = 'no corner of the envelope reaches a steady state (thermal runaway everywhere)';
    }
  }

  const ctx: CheckContext = { spec, card, model, noCard, band, window, windowFailure, vendorPackage: input.vendorPackage };
  for (const id of CHECK_IDS) {
    const result = CHECKS[id](ctx);
    if (result === null) continue;
    if ('skip' in result) notApplicable.push({ id, label: CHECK_LABELS[id], reason: result.skip });
    else checks.push(result);
  }

  const overall = overallVerdict(checks);
  return {
    overall,
    summary: summarise(overall, checks, band),
    specVersion: input.specVersion,
    cardVersion: input.cardVersion,
    marginalBandPercent: band,
    checks,
    notApplicable,
    model: model ? modelSummary(model) : null,
    mechanism: card ? mechanismOf(card.vzNom) : null,
    window,
    assumptions,
    warnings,
    caution: DESIGN_CAUTION,
    evaluatedAt: (input.now ?? new Date()).toISOString(),
  };
}

/** fail if any check fails; no data if any lacks data; marginal if any is marginal; else pass. */
export function overallVerdict(checks: ReadonlyArray<Pick<QualificationCheck, 'verdict'>>): QualificationVerdict {
  if (checks.some((c) => c.verdict === 'fail')) return 'fail';
  if (checks.some((c) => c.verdict === 'no-data')) return 'no-data';
  if (checks.some((c) => c.verdict === 'marginal')) return 'marginal';
  return 'pass';
}

/** A margin (% of the limit) read against the marginal band (%): below 0 fails, below the band is marginal. */
export function verdictOfMargin(margin: number, bandPercent: number): QualificationVerdict {
  if (margin < 0) return 'fail';
  if (margin < bandPercent) return 'marginal';
  return 'pass';
}

interface CheckContext {
  spec: Spec;
  card: EngineeringCardInput | null;
  model: BreakdownModel | null;
  noCard: string | null;
  band: number;
  window: VoltageWindow | null;
  windowFailure: string | null;
  vendorPackage: string | null;
}

type CheckResult = QualificationCheck | { skip: string } | null;

const CHECKS: Record<CheckId, (ctx: CheckContext) => CheckResult> = {
  'vz-window': vzWindowCheck,
  zd: zdCheck,
  'knee-ratio': kneeRatioCheck,
  'knee-span': kneeSpanCheck,
  leakage: leakageCheck,
  tc: tcCheck,
  'output-window': outputWindowCheck,
  'power-dissipation': powerDissipationCheck,
  'power-rating': powerRatingCheck,
  package: packageCheck,
};

function vzWindowCheck(ctx: CheckContext): CheckResult {
  const { spec, card, model } = ctx;
  const base = { id: 'vz-window' as const, quantity: 'voltage' as const, limitKind: 'window' as const, window: { min: spec.vz.min, max: spec.vz.max } };
  if (!card || !model) return noData(base, ctx.noCard!);
  if (card.vzMin == null || card.vzMax == null) {
    return noData(base, `the card gives no ${card.vzMin == null ? 'VZ min' : 'VZ max'}: the tolerance window at IZT is unknown`);
  }
  const assumptions: string[] = [];
  if (!sameCurrent(spec.iRef, card.izt)) {
    if (model.basis === 'none')
      return noData(base, `the card gives no impedance, so Vz cannot be moved from IZT (${amps(card.izt)}) to the reference current (${amps(spec.iRef)})`);
    assumptions.push(`moved from IZT (${amps(card.izt)}) to the reference current (${amps(spec.iRef)}) along the fitted curve (${model.basis} fit)`);
    if (model.basis !== 'two-point') assumptions.push(basisAssumption(model, spec.iRef, card.izt));
  }
  const low = diodeVoltage(model, spec.iRef, T_REF_C, 'min');
  const high = diodeVoltage(model, spec.iRef, T_REF_C, 'max');
  const lowMargin = percent(low - spec.vz.min, spec.vz.min);
  const highMargin = percent(spec.vz.max - high, spec.vz.max);
  const lowBinds = lowMargin <= highMargin;
  const margin = lowBinds ? lowMargin : highMargin;
  return {
    ...base,
    label: CHECK_LABELS['vz-window'],
    verdict: verdictOfMargin(margin, ctx.band),
    value: lowBinds ? low : high,
    limit: lowBinds ? spec.vz.min : spec.vz.max,
    range: { low, high },
    text: null,
    margin,
    detail: `${volts(low)} … ${volts(high)} at ${amps(spec.iRef)}, 25 °C, against the window ${volts(spec.vz.min)} … ${volts(spec.vz.max)}`,
    assumptions: [...assumptions, 'tolerance parts share the nominal curve shifted to VZ min/VZ max at IZT'],
    warnings: [],
  };
}

function zdCheck(ctx: CheckContext): CheckResult {
  const { spec, card, model } = ctx;
  if (spec.zdMax === null) return { skip: 'the spec sets no largest dynamic impedance' };
  const base = { id: 'zd' as const, quantity: 'resistance' as const, limitKind: 'max' as const, limit: spec.zdMax };
  if (!card || !model) return noData(base, ctx.noCard!);
  if (model.basis === 'none') return noData(base, 'the card gives no dynamic impedance (neither ZZT nor ZZK)');
  const zd = dynamicImpedance(model, spec.iRef, T_REF_C);
  const assumptions: string[] = [];
  if (!sameCurrent(spec.iRef, card.izt) || model.basis !== 'two-point') assumptions.push(basisAssumption(model, spec.iRef, card.izt));
  const margin = percent(spec.zdMax - zd, spec.zdMax);
  return {
    ...base,
    label: CHECK_LABELS.zd,
    verdict: verdictOfMargin(margin, ctx.band),
    value: zd,
    range: null,
    window: null,
    text: null,
    margin,
    detail: `Zd ${ohms(zd)} at ${amps(spec.iRef)}, 25 °C, against at most ${ohms(spec.zdMax)}`,
    assumptions: assumptions.filter(Boolean),
    warnings: [],
  };
}

function kneeRatioCheck(ctx: CheckContext): CheckResult {
  const { spec, card, model } = ctx;
  if (!spec.knee || spec.knee.maxRatio === null || spec.knee.iKnee === null) return { skip: 'the spec sets no knee ratio' };
  const { maxRatio, iKnee } = spec.knee;
  const base = { id: 'knee-ratio' as const, quantity: 'ratio' as const, limitKind: 'max' as const, limit: maxRatio };
  if (!card || !model) return noData(base, ctx.noCard!);
  const knee = kneeReading(model, card);
  if ('missing' in knee) return noData(base, knee.missing);
  const ratio = knee.zd(iKnee) / knee.zd(spec.iRef);
  const margin = percent(maxRatio - ratio, maxRatio);
  const warnings =
    iKnee < model.lowestTestCurrent
      ? [`the knee current (${amps(iKnee)}) lies below the card's IZK (${amps(model.lowestTestCurrent)}): the ratio is extrapolated`]
      : [];
  return {
    ...base,
    label: CHECK_LABELS['knee-ratio'],
    verdict: verdictOfMargin(margin, ctx.band),
    value: ratio,
    range: null,
    window: null,
    text: null,
    margin,
    detail: `Zd(${amps(iKnee)}) / Zd(${amps(spec.iRef)}) = ${fixed(ratio)} at 25 °C, against at most ${fixed(maxRatio)}`,
    assumptions: [knee.assumption],
    warnings,
  };
}

function kneeSpanCheck(ctx: CheckContext): CheckResult {
  const { spec, card, model } = ctx;
  if (!spec.knee || spec.knee.maxSpan === null) return { skip: 'the spec sets no largest voltage span' };
  const { maxSpan } = spec.knee;
  const { iMin, iMax } = spec.envelope;
  const base = { id: 'knee-span' as const, quantity: 'voltage' as const, limitKind: 'max' as const, limit: maxSpan };
  if (!card || !model) return noData(base, ctx.noCard!);
  const knee = kneeReading(model, card);
  if ('missing' in knee) return noData(base, knee.missing);
  const span = knee.span(iMin, iMax);
  const margin = percent(maxSpan - span, maxSpan);
  const warnings =
    iMin < model.lowestTestCurrent
      ? [`the lowest current (${amps(iMin)}) lies below the card's lowest test current (${amps(model.lowestTestCurrent)}): extrapolated`]
      : [];
  return {
    ...base,
    label: CHECK_LABELS['knee-span'],
    verdict: verdictOfMargin(margin, ctx.band),
    value: span,
    range: null,
    window: null,
    text: null,
    margin,
    detail: `V(${amps(iMax)}) − V(${amps(iMin)}) = ${volts(span)} for the nominal part at 25 °C, against at most ${volts(maxSpan)}`,
    assumptions: [knee.assumption, 'the curve alone, at Tj = 25 °C: self-heating and temperature drift belong to the output-window check'],
    warnings,
  };
}

function leakageCheck(ctx: CheckContext): CheckResult {
  const { spec, card } = ctx;
  if (!spec.leakage) return { skip: 'the spec sets no leakage limit' };
  const { irMax, vr } = spec.leakage;
  const base = { id: 'leakage' as const, quantity: 'current' as const, limitKind: 'max' as const, limit: irMax };
  if (!card) return noData(base, ctx.noCard!);
  if (card.irMax == null) return noData(base, 'the card gives no reverse leakage (IR max)');
  if (card.vr == null) return noData(base, 'the card gives IR max without the reverse voltage it was measured at (VR)');
  if (card.vr < vr * (1 - VOLTAGE_MATCH)) {
    return noData(
      base,
      `the card gives leakage at ${volts(card.vr)}, below the spec's ${volts(vr)}: leakage rises with reverse voltage, so that figure says nothing about ${volts(vr)}`,
    );
  }
  const assumptions =
    card.vr > vr * (1 + VOLTAGE_MATCH)
      ? [
          `the card states IR max at ${volts(card.vr)}, above the spec's ${volts(vr)}: leakage rises with reverse voltage, so it bounds the leakage at ${volts(vr)}`,
        ]
      : [];
  const margin = percent(irMax - card.irMax, irMax);
  return {
    ...base,
    label: CHECK_LABELS.leakage,
    verdict: verdictOfMargin(margin, ctx.band),
    value: card.irMax,
    range: null,
    window: null,
    text: null,
    margin,
    detail: `IR max ${amps(card.irMax)} at ${volts(card.vr)} against at most ${amps(irMax)} at ${volts(vr)}`,
    assumptions: [...assumptions, 'datasheet leakage is stated at 25 °C, as is the spec’s'],
    warnings: [],
  };
}

function tcCheck(ctx: CheckContext): CheckResult {
  const { spec, card } = ctx;
  if (!spec.tc) return { skip: 'the spec sets no temperature-coefficient window' };
  const { min, max } = spec.tc;
  const base = { id: 'tc' as const, quantity: 'tempCoVoltage' as const, limitKind: 'window' as const, window: { min, max } };
  if (!card) return noData(base, ctx.noCard!);
  if (card.tc == null) return noData(base, 'the card gives no temperature coefficient');
  const alpha = card.tc;
  const mechanism = mechanismOf(card.vzNom);
  const sign = mechanismSignWarning(card.vzNom, alpha);
  // Coefficient windows often straddle zero: measure against the larger end, not the nearer one.
  const reference = Math.max(Math.abs(min), Math.abs(max));
  const lowBinds = alpha - min <= max - alpha;
  const margin = reference > 0 ? percent(Math.min(alpha - min, max - alpha), reference) : alpha === 0 ? 0 : -100;
  return {
    ...base,
    label: CHECK_LABELS.tc,
    verdict: verdictOfMargin(margin, ctx.band),
    value: alpha,
    limit: lowBinds ? min : max,
    range: { low: alpha, high: alpha },
    text: null,
    margin,
    detail: `αVz ${tempCo(alpha)} (${mechanism} breakdown expected at ${volts(card.vzNom)}) against the window ${tempCo(min)} … ${tempCo(max)}`,
    assumptions: ['margin in % of the window end farther from zero'],
    warnings: sign ? [sign] : [],
  };
}

function outputWindowCheck(ctx: CheckContext): CheckResult {
  const { spec, card, model } = ctx;
  if (!spec.outputWindow) return { skip: 'the spec sets no output window over the envelope' };
  const { vMin, vMax } = spec.outputWindow;
  const base = { id: 'output-window' as const, quantity: 'voltage' as const, limitKind: 'window' as const, window: { min: vMin, max: vMax } };
  if (!card || !model) return noData(base, ctx.noCard!);
  const missing: string[] = [];
  if (card.vzMin == null || card.vzMax == null) missing.push('the tolerance window (VZ min, VZ max)');
  if (card.tc == null) missing.push('the temperature coefficient');
  if (card.rthJA == null) missing.push('RthJA for self-heating');
  const { iMin, iMax } = spec.envelope;
  if (model.basis === 'none' && !(sameCurrent(iMin, card.izt) && sameCurrent(iMax, card.izt))) missing.push('an impedance to move Vz away from IZT');
  if (missing.length) return noData(base, `the worst case over the envelope needs ${missing.join(', ')}, which the card does not give`);
  const envelopeText = `${amps(iMin)} … ${amps(iMax)}, ${celsius(spec.envelope.taMin)} … ${celsius(spec.envelope.taMax)}`;
  if (!ctx.window) {
    return failed(base, ctx.windowFailure ?? 'no steady state in the envelope');
  }
  const w = ctx.window;
  const runaway = w.warnings.filter((x) => x.startsWith('thermal runaway'));
  const lowMargin = percent(w.vMin - vMin, vMin);
  const highMargin = percent(vMax - w.vMax, vMax);
  const lowBinds = lowMargin <= highMargin;
  const margin = lowBinds ? lowMargin : highMargin;
  return {
    ...base,
    label: CHECK_LABELS['output-window'],
    verdict: runaway.length ? 'fail' : verdictOfMargin(margin, ctx.band),
    value: lowBinds ? w.vMin : w.vMax,
    limit: lowBinds ? vMin : vMax,
    range: { low: w.vMin, high: w.vMax },
    text: null,
    margin,
    detail: `${volts(w.vMin)} … ${volts(w.vMax)} over ${envelopeText} (tolerance and self-heating included), against ${volts(vMin)} … ${volts(vMax)}`,
    assumptions: [
      'currents from the lowest to the highest of the envelope (log-spaced, ends included) × both ambient ends × both tolerance ends',
      ...w.assumptions,
    ],
    warnings: w.warnings,
  };
}

function powerDissipationCheck(ctx: CheckContext): CheckResult {
  const { spec, card, model } = ctx;
  if (!spec.power) return { skip: 'the spec sets no power requirement' };
  const { deratingFraction } = spec.power;
  const base = { id: 'power-dissipation' as const, quantity: 'power' as const, limitKind: 'max' as const };
  if (!card || !model) return noData({ ...base, limit: null }, ctx.noCard!);
  const pc = powerCheck(model, card, spec.envelope, { policyFraction: deratingFraction, selfHeating: true });
  const at = pc.at ? ` at ${amps(pc.at.current)}, ${celsius(pc.at.taC)} ambient (Tj ${celsius(pc.at.tjC)})` : '';
  const common = {
    ...base,
    label: CHECK_LABELS['power-dissipation'],
    value: pc.power,
    limit: pc.allowed,
    range: null,
    window: null,
    text: null,
    assumptions: [...pc.assumptions, `the high tolerance end at the envelope's highest current (${amps(spec.envelope.iMax)}), both ambient ends`],
    warnings: pc.warnings,
  };
  if (pc.verdict === 'no-data') return { ...common, verdict: 'no-data', margin: null, detail: `no data: ${pc.reason}` };
  const margin = pc.margin !== null && pc.allowed !== null && pc.allowed > 0 ? percent(pc.margin, pc.allowed) : null;
  if (pc.verdict === 'fail') return { ...common, verdict: 'fail', margin, detail: pc.power === null ? pc.reason : `${watts(pc.power)}${at}: ${pc.reason}` };
  return {
    ...common,
    verdict: verdictOfMargin(margin ?? -1, ctx.band),
    margin,
    detail: `${watts(pc.power!)}${at} against ${formatPercent(deratingFraction, { digits: 4 })} of the derated ${watts(pc.deratedLimit!)} = ${watts(pc.allowed!)}`,
  };
}

function powerRatingCheck(ctx: CheckContext): CheckResult {
  const { spec, card } = ctx;
  if (!spec.power) return { skip: 'the spec sets no power requirement' };
  const { pdMin } = spec.power;
  const base = { id: 'power-rating' as const, quantity: 'power' as const, limitKind: 'min' as const, limit: pdMin };
  if (!card) return noData(base, ctx.noCard!);
  const refC = card.pdRefC ?? 25;
  let rating: number;
  const assumptions: string[] = [];
  if (card.pdMax != null) rating = card.pdMax;
  else {
    const derived = deratedPowerLimit(card, refC);
    if (derived.limit === null) return noData(base, `the card gives no power rating: ${derived.reason}`);
    rating = derived.limit;
    assumptions.push(`no PD max on the card: rating taken as (TJ max − ${celsius(refC)})/RthJA`);
  }
  const margin = percent(rating - pdMin, pdMin);
  // A rating is a category the vendor states (300 mW, 500 mW): meeting it exactly meets it;
  // the dissipation check is where the margin matters.
  assumptions.push('a rating equal to the spec’s minimum meets it: no marginal band for a stated rating');
  return {
    ...base,
    label: CHECK_LABELS['power-rating'],
    verdict: margin < 0 ? 'fail' : 'pass',
    value: rating,
    range: null,
    window: null,
    text: null,
    margin,
    detail: `rated ${watts(rating)} at ${celsius(refC)} against at least ${watts(pdMin)}`,
    assumptions,
    warnings: [],
  };
}

function packageCheck(ctx: CheckContext): CheckResult {
  const allowed = ctx.spec.packages;
  if (allowed.length === 0) return { skip: 'the spec allows any package' };
  const base = { id: 'package' as const, quantity: 'text' as const, limitKind: 'member' as const, text: { value: ctx.vendorPackage, allowed } };
  if (!ctx.vendorPackage) return noData(base, 'the vendor part has no package recorded');
  const key = (p: string) => p.trim().toUpperCase();
  const ok = allowed.some((p) => key(p) === key(ctx.vendorPackage!));
  return {
    ...base,
    label: CHECK_LABELS.package,
    verdict: ok ? 'pass' : 'fail',
    value: null,
    limit: null,
    range: null,
    window: null,
    margin: null,
    detail: `${ctx.vendorPackage} ${ok ? 'is' : 'is not'} among the allowed ${allowed.join(', ')}`,
    assumptions: ['package names compared without regard to case'],
    warnings: [],
  };
}

function basisAssumption(model: BreakdownModel, iRef: number, izt: number): string {
  switch (model.basis) {
    case 'izt-only':
      return `one impedance point (IZT, ZZT): RS assumed 0, Zd moved from IZT (${amps(izt)}) to the reference current (${amps(iRef)}) as NBV·Vt/I`;
    case 'izk-only':
      return 'no ZZT on the card: Zd at the reference current extrapolated from the knee point with RS = 0';
    case 'clamped':
      return 'the fit was clamped to RS = 0 (see the warnings)';
    default:
      return `Zd moved from IZT (${amps(izt)}) to the reference current (${amps(iRef)}) along the two-point fit`;
  }
}

type CheckBase = Pick<QualificationCheck, 'id' | 'quantity' | 'limitKind'> & Partial<Pick<QualificationCheck, 'limit' | 'window' | 'text'>>;

function noData(base: CheckBase, reason: string): QualificationCheck {
  return {
    label: CHECK_LABELS[base.id],
    verdict: 'no-data',
    value: null,
    limit: null,
    range: null,
    window: null,
    text: null,
    margin: null,
    detail: `no data: ${reason}`,
    assumptions: [],
    warnings: [],
    ...base,
  };
}

function failed(base: CheckBase, reason: string): QualificationCheck {
  return { ...noData(base, reason), verdict: 'fail', detail: reason };
}

function summarise(overall: QualificationVerdict, checks: QualificationCheck[], band: number): string {
  const named = (v: QualificationVerdict) => checks.filter((c) => c.verdict === v).map((c) => c.label.toLowerCase());
  switch (overall) {
    case 'fail':
      return `Fails: ${named('fail').join('; ')}`;
    case 'no-data':
      return `No data for: ${named('no-data').join('; ')}`;
    case 'marginal':
      return `Marginal (within ${fixed(band)} % of a limit): ${named('marginal').join('; ')}`;
    default:
      return `Every check passes with at least ${fixed(band)} % margin`;
  }
}

/** difference / |reference| in percent, with float noise on a limit read as exactly 0. */
function percent(difference: number, reference: number): number {
  const p = (difference / Math.abs(reference)) * 100;
  return Math.abs(p) < MARGIN_EPSILON ? 0 : p;
}

function sameCurrent(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(a, b);
}

function pushOnce(list: string[], item: string): void {
  if (!list.includes(item)) list.push(item);
}

/** For messages only: the verdict as people read it. */
export function verdictLabel(v: QualificationVerdict): string {
  return QUALIFICATION_VERDICT_LABELS[v];
}

const volts = (x: number) => formatQuantity(x, 'voltage');
const amps = (x: number) => formatQuantity(x, 'current');
const ohms = (x: number) => formatQuantity(x, 'resistance');
const watts = (x: number) => formatQuantity(x, 'power');
const tempCo = (x: number) => formatQuantity(x, 'tempCoVoltage');
/** A ratio or exponent in a sentence: four figures, trailing zeros dropped, a true minus. */
function fixed(x: number): string {
  return formatNumber(x, 4, { trim: true });
}
