/**
 * Writes invented bench measurements of a few demo vendor parts (test-fixtures/measurements):
 * reverse current and voltage points per sample, as a curve tracer would export them, drawn
 * around each part's demo card with the SPICE reverse-breakdown law
 * V = vz + αVz·(T − 25 °C) + NBV·Vt(T)·ln(I/izt) + RS·(I − izt), seeded noise, and one lot
 * that drifts above its datasheet window. Deterministic: a second run writes the same bytes.
 *
 *   npm run generate:measurements -w test-fixtures
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Prng } from './lib/prng';

interface Card {
  vzNom: number;
  izt: number;
  zzt: number;
  izk: number;
  zzk: number;
  tcVoltsPerK: number;
}
interface Plan {
  file: string;
  vendor: string;
  mpn: string;
  instrument: string;
  measuredOn: string;
  note: string;
  lots: Array<{ lot: string; samples: number; offset: number; spread: number; temperaturesC: number[] }>;
}

const PLANS: Plan[] = [
  {
    file: 'nmz-05v1-incoming-l2340.csv',
    vendor: 'NTC',
    mpn: 'NMZ-05V1',
    instrument: 'curve tracer CT-2 (bench 3)',
    measuredOn: '2026-11-18',
    note: 'incoming inspection, five samples at room temperature and three also hot',
    lots: [
      { lot: 'L2340', samples: 5, offset: -0.02, spread: 0.03, temperaturesC: [25] },
      { lot: 'L2344', samples: 3, offset: 0.01, spread: 0.02, temperaturesC: [25, 75] },
    ],
  },
  {
    file: 'qhz5v1af-lot-l2351.csv',
    vendor: 'QRY',
    mpn: 'QHZ5V1AF',
    instrument: 'source-measure unit SMU-1',
    measuredOn: '2026-11-25',
    note: 'second lot of the alternate: sits high in the window and past it',
    lots: [{ lot: 'L2351', samples: 6, offset: 0.24, spread: 0.04, temperaturesC: [25] }],
  },
  {
    file: 'nmz-06v8-engineering-samples.csv',
    vendor: 'NTC',
    mpn: 'NMZ-06V8',
    instrument: 'curve tracer CT-2 (bench 3)',
    measuredOn: '2026-10-30',
    note: 'engineering samples before the first order',
    lots: [{ lot: 'ES-44', samples: 4, offset: 0.0, spread: 0.025, temperaturesC: [25] }],
  },
];

const K_OVER_Q = 1.380649e-23 / 1.602176634e-19;
const root = join(__dirname, '..');

function cardOf(
  catalogue: { vendorParts: Array<{ vendor: string; mpn: string; ratingCard: { fields: Record<string, { value: number } | undefined> } }> },
  vendor: string,
  mpn: string,
): Card {
  const part = catalogue.vendorParts.find((p) => p.vendor === vendor && p.mpn === mpn);
  if (!part) throw new Error(`no demo part ${vendor} ${mpn}`);
  const f = part.ratingCard.fields;
  const need = (k: string): number => {
    const v = f[k]?.value;
    if (v === undefined) throw new Error(`${mpn} has no ${k}`);
    return v;
  };
  // The catalogue holds every value in SI: the coefficient in V/K.
  const tcVoltsPerK = f.tc?.value ?? 0;
  return { vzNom: need('vzNom'), izt: need('izt'), zzt: need('zzt'), izk: need('izk'), zzk: need('zzk'), tcVoltsPerK };
}

function gaussian(rng: Prng): number {
  const u = Math.max(rng.next(), 1e-12);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng.next());
}

function write(plan: Plan, card: Card, rng: Prng): string {
  // Two impedance points give the junction term a = NBV·Vt and RS (as the product's fit does).
  // The card's impedances are maxima: typical parts sit near 70 % of them.
  const a = (0.7 * (card.zzk - card.zzt) * card.izk * card.izt) / (card.izt - card.izk);
  const rs = Math.max(0, 0.7 * card.zzt - a / card.izt);
  const vt25 = K_OVER_Q * 298.15;
  const nbv = a / vt25;
  const lines = ['sample,lot,current (mA),voltage (V),temperature (°C)'];
  let n = 0;
  for (const lot of plan.lots) {
    for (let s = 0; s < lot.samples; s++) {
      n++;
      const id = `S${String(n).padStart(2, '0')}`;
      const vz = card.vzNom + lot.offset + lot.spread * gaussian(rng);
      const rsSample = rs * (1 + 0.08 * gaussian(rng));
      for (const tempC of lot.temperaturesC) {
        for (let k = 0; k < 12; k++) {
          const current = (card.izk / 2) * ((card.izt * 4) / (card.izk / 2)) ** (k / 11);
          const v =
            vz +
            card.tcVoltsPerK * (tempC - 25) +
            nbv * K_OVER_Q * (tempC + 273.15) * Math.log(current / card.izt) +
            rsSample * (current - card.izt) +
            0.0003 * gaussian(rng);
          lines.push(`${id},${lot.lot},${Number((current * 1e3).toPrecision(4))},${v.toFixed(4)},${tempC}`);
        }
      }
    }
  }
  return `${lines.join('\n')}\n`;
}

function main(): void {
  const catalogue = JSON.parse(readFileSync(join(root, 'catalogue', 'demo-catalogue.json'), 'utf8'));
  const dir = join(root, 'measurements');
  mkdirSync(dir, { recursive: true });
  const manifest = PLANS.map((plan, i) => {
    const rng = new Prng(20261204 + i);
    writeFileSync(join(dir, plan.file), write(plan, cardOf(catalogue, plan.vendor, plan.mpn), rng));
    const { lots: _lots, ...entry } = plan;
    return entry;
  });
  writeFileSync(join(dir, 'measurements.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  console.log(`wrote ${PLANS.length} measurement files to ${dir}`);
}

main();
