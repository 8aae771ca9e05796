import { formatQuantity, type NormalizedPoint, type NormalizeRequest, type NormalizeResponse } from '@shuntwise/contracts';
import { diodeVoltage, dynamicImpedance, fitBreakdownModel, modelSummary, type BreakdownModel } from './breakdown-model';
import { checkCard } from './card-checks';
import { DESIGN_CAUTION } from './caution';
import { mechanismOf } from './mechanism';
import { T_REF_C } from './physics';
import { junctionTemperatureC } from './self-heating';
import { spiceModelLine } from './spice-model';

const DEFAULT_TEMPERATURES_C: readonly number[] = [T_REF_C];

/** One normalised point as the core computes it: NaN marks thermal runaway, null missing data. */
export interface PointValues {
  current: number;
  tempC: number;
  tjC: number;
  vzMin: number | null;
  vzNom: number;
  vzMax: number | null;
  zd: number | null;
}

/**
 * The card at every ambient (°C) × current (A): vz window (V) and Zd (Ω), each tolerance
 * end with its own self-heated junction temperature when selfHeating and rthJA allow.
 * Points come ambient-major. A corner in thermal runaway gives NaN for its values.
 */
export function normalizePoints(
  model: BreakdownModel,
  currents: readonly number[],
  temperaturesC: readonly number[] = DEFAULT_TEMPERATURES_C,
  selfHeating = true,
): PointValues[] {
  const heat = selfHeating && model.rthJA !== null;
  const hasZd = model.basis !== 'none';
  const points: PointValues[] = new Array(temperaturesC.length * currents.length);
  let n = 0;
  for (let t = 0; t < temperaturesC.length; t++) {
    const taC = temperaturesC[t];
    for (let c = 0; c < currents.length; c++) {
      const current = currents[c];
      const tjC = heat ? junctionTemperatureC(model, current, taC, 'nom') : taC;
      let vzMin: number | null = null;
      let vzMax: number | null = null;
      if (model.hasVzMin) vzMin = diodeVoltage(model, current, heat ? junctionTemperatureC(model, current, taC, 'min') : taC, 'min');
      if (model.hasVzMax) vzMax = diodeVoltage(model, current, heat ? junctionTemperatureC(model, current, taC, 'max') : taC, 'max');
      points[n++] = {
        current,
        tempC: taC,
        tjC,
        vzMin,
        vzNom: diodeVoltage(model, current, tjC, 'nom'),
        vzMax,
        zd: hasZd ? dynamicImpedance(model, current, tjC) : null,
      };
    }
  }
  return points;
}

/** `POST /engineering/normalize`: the fitted model, the points, the mechanism, checks, the `.model` line. */
export function normalize(request: NormalizeRequest): NormalizeResponse {
  const { card } = request;
  const model = fitBreakdownModel(card);
  const selfHeating = request.selfHeating ?? true;
  const temperaturesC = request.temperaturesC ?? DEFAULT_TEMPERATURES_C;
  const points = normalizePoints(model, request.currents, temperaturesC, selfHeating);

  const issues = checkCard(card);
  const warnings = [...model.warnings];
  const assumptions: string[] = [];
  if (request.temperaturesC === undefined) assumptions.push('no temperatures asked for: evaluated at 25 °C ambient');
  if (selfHeating && model.rthJA !== null) assumptions.push('temperatures are ambients; Tj = Ta + RthJA·Vz·I, iterated to convergence');
  else if (selfHeating) warnings.push('no RthJA on the card: no self-heating, Tj = Ta');
  else assumptions.push('self-heating off: Tj = Ta');
  assumptions.push('Zd is the small-signal electrical impedance at Tj, as datasheets measure it');

  for (const current of request.currents) {
    if (current < model.lowestTestCurrent) {
      warnings.push(`${formatQuantity(current, 'current')} lies below the lowest current the card was measured at: extrapolated`);
    }
    if (card.izm != null && current > card.izm) warnings.push(`${formatQuantity(current, 'current')} exceeds IZM (${formatQuantity(card.izm, 'current')})`);
  }
  const runaway = points.some((p) => Number.isNaN(p.tjC) || Number.isNaN(p.vzMin) || Number.isNaN(p.vzMax));
  if (runaway) warnings.push('thermal runaway at some points (RthJA·I·dV/dT ≥ 1): no steady state, their values are null');
  if (points.some((p) => p.vzNom < 0.5 * card.vzNom)) {
    warnings.push('at some currents the model falls below half of VZ nom: far below the knee the log law is not a good description');
  }
  // The card's own findings (the tc sign among them) follow, named by field, unless the fit said the same.
  for (const issue of issues) {
    if (issue.severity === 'warning' && !model.warnings.includes(issue.message)) warnings.push(`${issue.field}: ${issue.message}`);
  }

  return {
    model: modelSummary(model),
    points: runaway ? points.map(withoutNaN) : points,
    mechanism: mechanismOf(card.vzNom),
    warnings,
    assumptions,
    issues,
    spiceModel: spiceModelLine(model),
    caution: DESIGN_CAUTION,
  };
}

/** JSON has no NaN: a runaway point says null, as the response schema allows. */
function withoutNaN(p: PointValues): NormalizedPoint {
  const clean = (x: number | null) => (x === null || Number.isNaN(x) ? null : x);
  return { current: p.current, tempC: p.tempC, tjC: clean(p.tjC), vzMin: clean(p.vzMin), vzNom: clean(p.vzNom), vzMax: clean(p.vzMax), zd: clean(p.zd) };
}
