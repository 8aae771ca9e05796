// Engineering core throughput: normalise 100 000 generated cards at 3 currents × 3 ambients
// with self-heating, through the engine (fitBreakdownModel + normalizePoints) and through a
// bare loop doing the same arithmetic on flat arrays, in the same run. Target: ≤ 3×.
import type { EngineeringCard } from '@shuntwise/contracts';
import { fitBreakdownModel } from '../src/engineering/breakdown-model';
import { normalize, normalizePoints } from '../src/engineering/normalize';
import { K_OVER_Q, ZERO_CELSIUS_K, thermalVoltage } from '../src/engineering/physics';
import { median, seededRandom } from './bench-support';

const CARDS = 100_000;
const CURRENTS = [0.001, 0.005, 0.02];
const AMBIENTS_C = [-40, 25, 85];
const ROUNDS = 5;

function generateCards(n: number): EngineeringCard[] {
  const rnd = seededRandom(20261201);
  const logU = (min: number, max: number) => Math.exp(Math.log(min) + rnd() * Math.log(max / min));
  const cards: EngineeringCard[] = [];
  for (let i = 0; i < n; i++) {
    const vzNom = logU(2.4, 75);
    const izt = logU(1e-3, 50e-3);
    const zzt = (logU(0.003, 0.08) * vzNom) / izt;
    const tol = logU(0.01, 0.1);
    const sign = vzNom < 5.5 ? -1 : 1;
    const tcPercent = sign * logU(0.005, 0.09);
    const card: EngineeringCard = {
      vzNom,
      vzMin: vzNom * (1 - tol),
      vzMax: vzNom * (1 + tol),
      izt,
      zzt,
      izk: null,
      zzk: null,
      tc: (tcPercent / 100) * vzNom,
      pdMax: 0.5,
      tjMax: 175,
      rthJA: logU(60, 450),
    };
    if (rnd() < 0.7) {
      card.izk = izt / logU(5, 50);
      card.zzk = Math.min(zzt * logU(1.5, 60), (0.9 * vzNom) / card.izk);
    }
    cards.push(card);
  }
  return cards;
}

/** The engine as later work calls it: fit, then the points. Returns a checksum of every value. */
function runEngine(cards: readonly EngineeringCard[]): number {
  let sum = 0;
  for (let i = 0; i < cards.length; i++) {
    const points = normalizePoints(fitBreakdownModel(cards[i]), CURRENTS, AMBIENTS_C, true);
    for (let p = 0; p < points.length; p++) {
      const pt = points[p];
      sum += pt.vzNom + pt.vzMin! + pt.vzMax! + pt.zd! + pt.tjC;
    }
  }
  return sum;
}

const VT_REF = thermalVoltage(25);
const OUT = new Float64Array(CURRENTS.length * AMBIENTS_C.length * 5);

/** Same arithmetic, no structure: locals and one reused Float64Array per card. */
function runBare(cards: readonly EngineeringCard[]): number {
  let sum = 0;
  const nI = CURRENTS.length;
  for (let i = 0; i < cards.length; i++) {
    const c = cards[i];
    const vzNom = c.vzNom;
    const izt = c.izt;
    const zzt = c.zzt!;
    let a = zzt * izt;
    let rs = 0;
    if (c.izk != null && c.zzk != null) {
      const a2 = ((c.zzk - zzt) * c.izk * izt) / (izt - c.izk);
      const r2 = zzt - a2 / izt;
      if (a2 > 0 && r2 >= 0) {
        a = a2;
        rs = r2;
      }
    }
    const nbv = a / VT_REF;
    const alpha = c.tc!;
    const rth = c.rthJA!;
    const vzLow = c.vzMin!;
    const vzHigh = c.vzMax!;
    for (let t = 0; t < AMBIENTS_C.length; t++) {
      const ta = AMBIENTS_C[t];
      for (let k = 0; k < nI; k++) {
        const current = CURRENTS[k];
        const ln = Math.log(current / izt);
        const gain = rth * current * (alpha + nbv * K_OVER_Q * ln);
        const base = (t * nI + k) * 5;
        for (let corner = 0; corner < 3; corner++) {
          const vz = corner === 0 ? vzNom : corner === 1 ? vzLow : vzHigh;
          let tj = ta;
          for (let it = 0; it < 20; it++) {
            const v = vz + alpha * (tj - 25) + nbv * K_OVER_Q * (tj + ZERO_CELSIUS_K) * ln + rs * (current - izt);
            const residual = tj - ta - rth * v * current;
            if (Math.abs(residual) < 1e-9) break;
            tj -= residual / (1 - gain);
          }
          OUT[base + corner] = vz + alpha * (tj - 25) + nbv * K_OVER_Q * (tj + ZERO_CELSIUS_K) * ln + rs * (current - izt);
          if (corner === 0) {
            OUT[base + 3] = (nbv * K_OVER_Q * (tj + ZERO_CELSIUS_K)) / current + rs;
            OUT[base + 4] = tj;
          }
        }
      }
    }
    for (let j = 0; j < OUT.length; j++) sum += OUT[j];
  }
  return sum;
}

function time(fn: () => number): { ms: number; sum: number } {
  const start = process.hrtime.bigint();
  const sum = fn();
  return { ms: Number(process.hrtime.bigint() - start) / 1e6, sum };
}

const cards = generateCards(CARDS);
// Warm both paths so the JIT has optimised them before timing.
runEngine(cards.slice(0, 5000));
runBare(cards.slice(0, 5000));

const engineMs: number[] = [];
const bareMs: number[] = [];
let engineSum = 0;
let bareSum = 0;
for (let r = 0; r < ROUNDS; r++) {
  const e = time(() => runEngine(cards));
  const b = time(() => runBare(cards));
  engineMs.push(e.ms);
  bareMs.push(b.ms);
  engineSum = e.sum;
  bareSum = b.sum;
}
const engineNs = (median(engineMs) * 1e6) / CARDS;
const bareNs = (median(bareMs) * 1e6) / CARDS;
const relDiff = Math.abs(engineSum - bareSum) / Math.abs(bareSum);

// The whole HTTP answer (checks, warnings, the .model line) on a slice, for scale.
const FULL = 20_000;
const full = time(() => {
  let n = 0;
  for (let i = 0; i < FULL; i++) n += normalize({ card: cards[i], currents: CURRENTS, temperaturesC: AMBIENTS_C }).points.length;
  return n;
});

console.log(`cards: ${CARDS}, points per card: ${CURRENTS.length} currents × ${AMBIENTS_C.length} ambients × 3 tolerance ends, self-heating on`);
console.log(
  `engine (fitBreakdownModel + normalizePoints): ${engineNs.toFixed(0)} ns/card (median of ${ROUNDS}: ${engineMs.map((m) => m.toFixed(0)).join(', ')} ms)`,
);
console.log(
  `bare loop, same arithmetic:                    ${bareNs.toFixed(0)} ns/card (median of ${ROUNDS}: ${bareMs.map((m) => m.toFixed(0)).join(', ')} ms)`,
);
console.log(`ratio engine/bare: ${(engineNs / bareNs).toFixed(2)}× (target ≤ 3×)${engineNs / bareNs <= 3 ? '' : '  ** above target **'}`);
console.log(`checksums agree to ${relDiff.toExponential(1)} (same numbers from both paths)`);
console.log(`full normalize() response incl. card checks and .model line: ${((full.ms * 1e6) / FULL).toFixed(0)} ns/card over ${FULL} cards`);
