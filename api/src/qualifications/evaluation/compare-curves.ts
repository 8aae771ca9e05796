import type { CompareCurve, ComparePowerLimit, EngineeringCardInput, NormalizedPoint, Spec } from '@shuntwise/contracts';
import { fitBreakdownModel } from '../../engineering/breakdown-model';
import { normalizePoints } from '../../engineering/normalize';
import { T_REF_C } from '../../engineering/physics';
import { deratedPowerLimit } from '../../engineering/power';

const GRID_POINTS = 41;

/** The ambients the Compare chart draws: 25 °C and the envelope's ends, ascending, each once. */
export function compareTemperatures(spec: Spec): number[] {
  return [...new Set([T_REF_C, spec.envelope.taMin, spec.envelope.taMax])].sort((a, b) => a - b);
}

/**
 * Currents for the Compare chart (A): log-spaced from half the lowest current the spec names
 * (iKnee, iMin) to 1.5 × the highest (iMax, iRef), with those currents themselves included
 * so the chart has points exactly where the checks look.
 */
export function currentGrid(spec: Spec, points = GRID_POINTS): number[] {
  const named = [spec.iRef, spec.envelope.iMin, spec.envelope.iMax, ...(spec.knee?.iKnee != null ? [spec.knee.iKnee] : [])];
  const lo = Math.min(...named) / 2;
  const hi = Math.max(...named) * 1.5;
  const step = Math.log(hi / lo) / (points - 1);
  const grid = Array.from({ length: points }, (_, k) => (k === points - 1 ? hi : lo * Math.exp(step * k)));
  return [...new Set([...grid, ...named])].sort((a, b) => a - b);
}

/**
 * One breakdown curve per ambient from the card's fitted model, tolerance ends included,
 * each point with its self-heated junction (the same law as the checks). Throws the core's
 * EngineeringInputError for a self-contradicting card.
 */
export function compareCurves(card: EngineeringCardInput, currents: readonly number[], temperaturesC: readonly number[]): CompareCurve[] {
  const model = fitBreakdownModel(card);
  const points = normalizePoints(model, currents, temperaturesC, true);
  return temperaturesC.map((tempC, t) => ({ tempC, points: points.slice(t * currents.length, (t + 1) * currents.length).map(clean) }));
}

/** JSON has no NaN: a point in thermal runaway says null. */
function clean(p: {
  current: number;
  tempC: number;
  tjC: number;
  vzMin: number | null;
  vzNom: number;
  vzMax: number | null;
  zd: number | null;
}): NormalizedPoint {
  const c = (x: number | null) => (x === null || Number.isNaN(x) ? null : x);
  return { current: p.current, tempC: p.tempC, tjC: c(p.tjC), vzMin: c(p.vzMin), vzNom: c(p.vzNom), vzMax: c(p.vzMax), zd: c(p.zd) };
}

/**
 * A source's own dissipation limit at the envelope's hottest ambient (where a derated rating
 * is lowest): the core's derating of its card, times the spec's fraction when it sets one.
 */
export function comparePowerLimit(card: EngineeringCardInput, spec: Spec): ComparePowerLimit {
  const ambientC = spec.envelope.taMax;
  const { limit, basis, reason } = deratedPowerLimit(card, ambientC);
  const policyFraction = spec.power?.deratingFraction ?? null;
  return { ambientC, derated: limit, basis, reason, policyFraction, allowed: limit !== null && policyFraction !== null ? limit * policyFraction : null };
}
