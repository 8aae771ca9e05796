import { roundTo, sig } from './numbers';
import { SeriesData } from './series';
import { AnswerKey, AnswerVariant, Field, FIELDS } from './types';

/**
 * The demo catalogue: one invented company, its house parts with specs, the eight
 * invented vendors and their 120 parts, whose rating cards are exactly what the generated
 * datasheets print. All numbers SI (V, A, Ω, W, °C, K/W, V/K).
 *
 * Each link of an alternate to a house part carries an `intent`: the outcome the demo was
 * built to show, estimated here with a simplified 25 °C check. The qualification engine's
 * own evaluation is what counts; the intent only documents the mix.
 */

export const COMPANY = {
  name: 'Oakhollow Instruments Ltd',
  shortName: 'Oakhollow',
  description: 'Invented maker of industrial sensor interfaces and process controllers (demo data).',
};

type Family = 'small' | 'power' | 'through-hole';

interface HousePartPlan {
  partNumber: string;
  family: Family;
  approved: string;
  alternates: string[];
  status?: 'active' | 'not-for-new-designs' | 'end-of-life';
  use: string;
  /** Give the spec an output window over the envelope (set 3 % outside the approved part's band). */
  outputWindow?: boolean;
  /** Knee limit style. */
  knee?: 'ratio' | 'span' | 'both';
  /** Packages allowed beyond the family's. */
  extraPackages?: string[];
  /** Widening of the Vz window beyond the approved part's own (fraction). */
  vzWiden?: number;
}

const PLANS: HousePartPlan[] = [
  {
    partNumber: 'OHI-ZD-1024',
    family: 'small',
    approved: 'BRZ05-2V4',
    alternates: ['CBX3-2.4'],
    status: 'not-for-new-designs',
    use: 'bias for the legacy thermocouple front end',
  },
  { partNumber: 'OHI-ZD-1033', family: 'small', approved: 'BRZ05-3V3', alternates: ['CBX3-3.3'], use: 'clamp on 3.3 V logic inputs' },
  {
    partNumber: 'OHI-ZD-1036',
    family: 'small',
    approved: 'NMZ-03V6',
    alternates: ['BRZ05-3V6'],
    use: 'comparator threshold, ±2 % part',
    vzWiden: 0.022,
    extraPackages: ['SOT-23'],
  },
  { partNumber: 'OHI-ZD-1047', family: 'small', approved: 'BRZ05-4V7', alternates: ['QHZ4V7A'], use: 'sensor supply clamp' },
  {
    partNumber: 'OHI-ZD-1051',
    family: 'small',
    approved: 'BRZ05-5V1',
    alternates: ['QHZ5V1AF', 'NMZ-05V1', 'CBX3-5.1'],
    use: '5 V rail over-voltage clamp',
    outputWindow: true,
    extraPackages: ['SOT-23'],
  },
  { partNumber: 'OHI-ZD-1056', family: 'small', approved: 'BRZ05-5V6', alternates: ['QHZ5V6A'], use: 'reference for the 4–20 mA loop driver' },
  { partNumber: 'OHI-ZD-1062', family: 'small', approved: 'QHZ6V2AF', alternates: ['BRZ05-6V2'], use: 'low-drift reference (near-zero TC)', knee: 'both' },
  {
    partNumber: 'OHI-ZD-1068',
    family: 'small',
    approved: 'BRZ05-6V8',
    alternates: ['QHZ6V8A', 'NMZ-06V8'],
    use: 'gate clamp on the MOSFET driver',
    extraPackages: ['SOT-23'],
  },
  { partNumber: 'OHI-ZD-1082', family: 'small', approved: 'BRZ05-8V2', alternates: ['QHZ8V2AF'], use: 'auxiliary rail limiter' },
  {
    partNumber: 'OHI-ZD-1100',
    family: 'small',
    approved: 'BRZ05-10',
    alternates: ['QHZ10A', 'NMZ-10', 'CBX3-10'],
    use: '10 V bias for the analogue front end',
    outputWindow: true,
    extraPackages: ['SOT-23'],
  },
  { partNumber: 'OHI-ZD-1120', family: 'small', approved: 'QHZ12AF', alternates: ['BRZ05-12'], use: 'relay-driver clamp' },
  { partNumber: 'OHI-ZD-1150', family: 'small', approved: 'BRZ05-15', alternates: ['QHZ15A'], use: '15 V op-amp rail clamp', knee: 'span' },
  {
    partNumber: 'OHI-ZD-1240',
    family: 'small',
    approved: 'BRZ05-24',
    alternates: ['QHZ24AF', 'NMZ-24'],
    use: '24 V input protection',
    extraPackages: ['SOT-23'],
  },
  { partNumber: 'OHI-ZD-2082', family: 'power', approved: 'LVD1-082', alternates: ['TPZ15-8V2'], use: 'shunt regulator on the display board' },
  { partNumber: 'OHI-ZD-2100', family: 'power', approved: 'LVD1-100', alternates: ['TPZ15-10'], use: 'shunt regulator for the isolated sensor supply' },
  { partNumber: 'OHI-ZD-2110', family: 'power', approved: 'LVD1-110', alternates: ['TPZ15-11'], use: '11 V clamp for the valve-driver supply' },
  {
    partNumber: 'OHI-ZD-2120',
    family: 'power',
    approved: 'LVD1-120',
    alternates: ['TPZ15-12', 'AM-ZR12'],
    use: '12 V auxiliary supply from the 24 V bus',
    outputWindow: true,
  },
  { partNumber: 'OHI-ZD-2150', family: 'power', approved: 'TPZ15-15', alternates: ['LVD1-150'], use: 'gate-drive supply clamp' },
  { partNumber: 'OHI-ZD-2160', family: 'power', approved: 'TPZ15-16', alternates: ['LVD1-160'], use: '16 V rail clamp on the motor-drive board' },
  { partNumber: 'OHI-ZD-2180', family: 'power', approved: 'LVD1-180', alternates: ['TPZ15-18'], use: 'field-bus surge clamp' },
  {
    partNumber: 'OHI-ZD-3150',
    family: 'through-hole',
    approved: 'ODW15',
    alternates: ['AM-ZR15'],
    status: 'not-for-new-designs',
    use: 'retrofit board, through-hole',
  },
  {
    partNumber: 'OHI-ZD-3330',
    family: 'through-hole',
    approved: 'ODW33',
    alternates: ['TPZ15-33'],
    status: 'end-of-life',
    use: 'legacy 30 V reference, through-hole',
  },
];

const FAMILY = {
  small: { packages: ['SOD-123', 'SOD-123F', 'SOD-323'], iRef: 5e-3, iKnee: 0.5e-3, ta: [-40, 85] as [number, number], label: 'SMD' },
  power: { packages: ['SMA', 'SMB'], iRef: 20e-3, iKnee: 1e-3, ta: [-40, 85] as [number, number], label: 'power SMD' },
  'through-hole': { packages: ['DO-35', 'DO-41'], iRef: 5e-3, iKnee: 0.5e-3, ta: [-25, 70] as [number, number], label: 'axial' },
} as const;

/** The values of one rating card, SI. */
type Card = Partial<Record<Field, number>> & { package: string };

interface Model {
  nbvVt: number;
  rs: number;
  assumed: boolean;
}

/** Zd(I) = NBV·Vt/I + RS through (izt, zzt) and (izk, zzk); one point only → half and half, stated. */
function fit(c: Card): Model {
  if (c.izk !== undefined && c.zzk !== undefined) {
    const nbvVt = (c.zzk - c.zzt!) / (1 / c.izk - 1 / c.izt!);
    const rs = c.zzt! - nbvVt / c.izt!;
    if (rs < 0) return { nbvVt: c.zzt! * c.izt!, rs: 0, assumed: false };
    return { nbvVt, rs, assumed: false };
  }
  return { nbvVt: (c.zzt! * c.izt!) / 2, rs: c.zzt! / 2, assumed: true };
}

const shift = (m: Model, from: number, to: number) => m.nbvVt * Math.log(to / from) + m.rs * (to - from);
const zd = (m: Model, i: number) => m.nbvVt / i + m.rs;

export interface Spec {
  version: number;
  iRef: number;
  vz: { min: number; nom: number; max: number };
  zdMax: number;
  knee: { iKnee: number; maxRatio: number | null; maxSpan: number | null };
  leakage: { irMax: number; vr: number };
  tc: { min: number; max: number };
  power: { pdMin: number; deratingFraction: number };
  packages: string[];
  envelope: { iMin: number; iMax: number; taMin: number; taMax: number };
  outputWindow: { vMin: number; vMax: number } | null;
  marginalBand: number;
}

type Verdict = 'pass' | 'marginal' | 'fail' | 'no data';

/** Output band over the envelope corners: tolerance, current and ambient (no self-heating here). */
function outputBand(spec: Spec, c: Card): { low: number; high: number } {
  const m = fit(c);
  const lowT = Math.min(c.tc! * (spec.envelope.taMin - 25), c.tc! * (spec.envelope.taMax - 25));
  const highT = Math.max(c.tc! * (spec.envelope.taMin - 25), c.tc! * (spec.envelope.taMax - 25));
  return {
    low: c.vzMin! + shift(m, c.izt!, spec.envelope.iMin) + lowT,
    high: c.vzMax! + shift(m, c.izt!, spec.envelope.iMax) + highT,
  };
}

/** The simplified check behind each link's intent (25 °C model plus tc and derating). */
function roughCheck(spec: Spec, c: Card): { verdict: Verdict; reason: string } {
  const m = fit(c);
  const margins: Record<string, number | null> = {};
  const dRef = shift(m, c.izt!, spec.iRef);
  margins['Zener-voltage window'] = Math.min((c.vzMin! + dRef - spec.vz.min) / spec.vz.min, (spec.vz.max - (c.vzMax! + dRef)) / spec.vz.max);
  margins['dynamic impedance'] = (spec.zdMax - zd(m, spec.iRef)) / spec.zdMax;
  if (m.assumed) margins.knee = null;
  else {
    const ks: number[] = [];
    if (spec.knee.maxRatio !== null) ks.push((spec.knee.maxRatio - zd(m, spec.knee.iKnee) / zd(m, spec.iRef)) / spec.knee.maxRatio);
    if (spec.knee.maxSpan !== null) ks.push((spec.knee.maxSpan - shift(m, spec.envelope.iMin, spec.envelope.iMax)) / spec.knee.maxSpan);
    margins.knee = Math.min(...ks);
  }
  margins.leakage = c.vr! < spec.leakage.vr * (1 - 1e-9) ? null : (spec.leakage.irMax - c.irMax!) / spec.leakage.irMax;
  margins['temperature coefficient'] = Math.min(c.tc! - spec.tc.min, spec.tc.max - c.tc!) / Math.max(Math.abs(spec.tc.min), Math.abs(spec.tc.max));
  const vMaxAtIMax = c.vzMax! + shift(m, c.izt!, spec.envelope.iMax) + Math.max(0, c.tc!) * (spec.envelope.taMax - 25);
  const dissipation = vMaxAtIMax * spec.envelope.iMax;
  const allowed = spec.power.deratingFraction * c.pdMax! * Math.max(0, (c.tjMax! - spec.envelope.taMax) / (c.tjMax! - 25));
  margins.power = Math.min((allowed - dissipation) / allowed, (c.pdMax! - spec.power.pdMin) / spec.power.pdMin);
  if (spec.outputWindow) {
    const { low, high } = outputBand(spec, c);
    margins['output window'] = Math.min((low - spec.outputWindow.vMin) / spec.outputWindow.vMin, (spec.outputWindow.vMax - high) / spec.outputWindow.vMax);
  }
  margins.package = spec.packages.includes(c.package) ? 1 : -1;
  const failing = Object.entries(margins)
    .filter(([, v]) => v !== null && v < 0)
    .map(([k]) => k);
  const missing = Object.entries(margins)
    .filter(([, v]) => v === null)
    .map(([k]) => k);
  const marginal = Object.entries(margins)
    .filter(([, v]) => v !== null && v >= 0 && v < spec.marginalBand)
    .map(([k]) => k);
  if (failing.length) return { verdict: 'fail', reason: `fails: ${failing.join(', ')}` };
  if (missing.length) {
    const why = missing.map((k) =>
      k === 'knee' ? 'knee (no knee point in the datasheet)' : k === 'leakage' ? `leakage (given only at ${c.vr} V, below the spec's ${spec.leakage.vr} V)` : k,
    );
    return { verdict: 'no data', reason: `no data: ${why.join(', ')}` };
  }
  if (marginal.length) return { verdict: 'marginal', reason: `marginal: ${marginal.join(', ')}` };
  return { verdict: 'pass', reason: 'every check inside its limit with margin' };
}

function niceUp(x: number): number {
  return sig(x * (1 + 1e-9), 2) >= x ? sig(x, 2) : sig(x * 1.05, 2);
}

function specFor(plan: HousePartPlan, a: Card): Spec {
  const fam = FAMILY[plan.family];
  const m = fit(a);
  const iRef = plan.partNumber === 'OHI-ZD-3330' ? 2e-3 : fam.iRef;
  const dRef = shift(m, a.izt!, iRef);
  const widen = plan.vzWiden ?? (plan.family === 'power' ? 0.035 : 0.025);
  const nom = roundTo(a.vzNom! + dRef, 3);
  const [taMin, taMax] = fam.ta;
  const fraction = 0.5;
  const allowed = fraction * a.pdMax! * ((a.tjMax! - taMax) / (a.tjMax! - 25));
  const vHot = a.vzMax! * 1.1;
  const iMax = roundTo(Math.min(2 * iRef, (0.7 * allowed) / vHot) * 1e3, 1) / 1e3;
  const iMin = roundTo(Math.min(0.4 * iRef, iMax / 2) * 1e3, 1) / 1e3;
  const knee = plan.knee ?? 'ratio';
  const ratio = zd(m, fam.iKnee) / zd(m, iRef);
  const span = shift(m, iMin, iMax);
  const tcAbs = Math.max(0.6e-3, 0.45 * Math.abs(a.tc!));
  const spec: Spec = {
    version: 1,
    iRef,
    vz: { min: roundTo((a.vzMin! + dRef) * (1 - widen), 3), nom, max: roundTo((a.vzMax! + dRef) * (1 + widen), 3) },
    zdMax: niceUp(zd(m, iRef) * 1.3),
    knee: {
      iKnee: fam.iKnee,
      maxRatio: knee === 'span' ? null : roundTo(ratio * 1.35, 1),
      maxSpan: knee === 'ratio' ? null : roundTo(span * 1.35, 3),
    },
    leakage: { irMax: sig(a.irMax! * 2, 1), vr: a.vr! },
    tc: { min: roundTo(a.tc! - tcAbs, 5), max: roundTo(a.tc! + tcAbs, 5) },
    power: { pdMin: roundTo(a.pdMax! * 0.6, 2), deratingFraction: fraction },
    packages: [...fam.packages, ...(plan.extraPackages ?? [])],
    envelope: { iMin, iMax, taMin, taMax },
    outputWindow: null,
    marginalBand: 0.02,
  };
  if (plan.outputWindow) {
    const band = outputBand(spec, a);
    spec.outputWindow = { vMin: roundTo(band.low * 0.97, 2), vMax: roundTo(band.high * 1.03, 2) };
  }
  return spec;
}

function cardOf(v: AnswerVariant): Card {
  const c: Card = { package: v.package.value };
  for (const f of FIELDS) if (v.fields[f]) c[f] = v.fields[f]!.si;
  return c;
}

const LIFECYCLE: Record<string, { state: string; note: string }> = {
  CRB: { state: 'last-time-buy', note: 'Vendor notice: last orders accepted until 2026-09-30; SOD-323 line moves to a new site.' },
  OST: { state: 'active', note: 'Glass line; lead times 16–20 weeks.' },
};

export function buildCatalogue(series: SeriesData[], keys: AnswerKey[]) {
  const vendors = series.map((s) => ({ code: s.def.vendorCode, name: s.def.vendor, note: 'Invented vendor (demo data).' }));
  const datasheets = keys.map((k, i) => ({
    file: k.file,
    vendor: series[i].def.vendorCode,
    title: k.title,
    layout: k.layout,
    pages: k.pages,
  }));
  const vendorParts = keys.flatMap((k, i) =>
    k.variants.map((v) => {
      const code = series[i].def.vendorCode;
      const life = LIFECYCLE[code] ?? { state: 'active', note: '' };
      const fields: Record<string, { value: number; printed: string; page: number; unit?: string; valueInUnit?: number }> = {};
      for (const f of FIELDS) {
        const a = v.fields[f];
        if (a) fields[f] = { value: a.si, printed: `${a.value} ${a.unit}`, page: a.page };
        // The card keeps tc in the unit printed (mV/K or %/K) beside its V/K value.
        if (a && f === 'tc') {
          const percent = a.unit.startsWith('%');
          fields[f] = { ...fields[f], unit: percent ? '%/K' : 'mV/K', valueInUnit: Number(a.value.replace('−', '-')) };
        }
      }
      return {
        vendor: code,
        mpn: v.mpn,
        package: v.package.value,
        lifecycle: life.state,
        lifecycleNote: life.note,
        datasheet: { file: k.file, page: v.fields.vzNom!.page },
        ratingCard: { pdRefC: 25, fields },
      };
    }),
  );
  const byMpn = new Map(keys.flatMap((k, i) => k.variants.map((v) => [v.mpn, { v, vendor: series[i].def.vendorCode }] as const)));
  const houseParts = PLANS.map((plan) => {
    const approved = byMpn.get(plan.approved);
    if (!approved) throw new Error(`${plan.partNumber}: unknown approved part ${plan.approved}`);
    const a = cardOf(approved.v);
    const spec = specFor(plan, a);
    const own = roughCheck(spec, a);
    if (own.verdict !== 'pass') throw new Error(`${plan.partNumber}: approved part ${plan.approved} does not pass its own spec (${own.reason})`);
    const sources = [
      { vendor: approved.vendor, mpn: plan.approved, role: 'approved', intent: own },
      ...plan.alternates.map((mpn) => {
        const alt = byMpn.get(mpn);
        if (!alt) throw new Error(`${plan.partNumber}: unknown alternate ${mpn}`);
        return { vendor: alt.vendor, mpn, role: 'alternate', intent: roughCheck(spec, cardOf(alt.v)) };
      }),
    ];
    const vz = approved.v.fields.vzNom!.value;
    const fam = FAMILY[plan.family];
    return {
      partNumber: plan.partNumber,
      description: `Regulator diode ${vz} V, ${fam.label}, ${plan.use}`,
      status: plan.status ?? 'active',
      spec,
      sources,
    };
  });
  return {
    about: 'Invented demo data for Shuntwise: company, vendors, part numbers and datasheets are made up.',
    company: COMPANY,
    vendors,
    datasheets,
    vendorParts,
    houseParts,
  };
}

export type Catalogue = ReturnType<typeof buildCatalogue>;
