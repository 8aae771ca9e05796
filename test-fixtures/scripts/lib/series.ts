import { LEAKAGE_LADDER_UA, leakageBase, leakageVoltage, tcPercentPerK, vzCode, vzRange, zdTypical } from './diode-physics';
import { ceilLimit, fixed, plain, sig } from './numbers';
import { Prng } from './prng';
import { Field, Printed } from './types';

/** How a vendor writes its units and signs. */
export interface PrintStyle {
  micro: 'µ' | 'μ' | 'u';
  /** Greek capital omega (U+03A9), the ohm sign (U+2126) or ASCII. */
  ohm: '\u03A9' | '\u2126' | 'ohm';
  minus: '−' | '-';
  plusSign: boolean;
  tcUnit: 'mV/°C' | 'mV/K' | '%/K';
  /** Decimals of VZ min/max below 10 V and from 10 V up. */
  vzDecimals: [number, number];
  /** Decimals of VZ nom below 10 V and from 10 V up. */
  vzNomDecimals: [number, number];
}

export interface SeriesDef {
  vendorCode: string;
  vendor: string;
  series: string;
  file: string;
  mpn: (vz: number, index: number) => string;
  packageOf: (vz: number, index: number) => string;
  voltages: number[];
  pdW: number;
  pdUnit: 'mW' | 'W';
  tjMax: number;
  rthUnit: 'K/W' | '°C/W';
  tolerance: number;
  izt: (vz: number) => number;
  /** Knee current in A, or undefined when the datasheet gives no knee point. */
  izk?: (vz: number) => number;
  vr: (vz: number) => number;
  /** Leakage scale against a small-signal part. */
  irFactor: number;
  /** Impedance scale: how conservative the vendor's limits are. */
  zFactor: number;
  izm: boolean;
  style: PrintStyle;
  seed: number;
}

export interface VariantData {
  mpn: string;
  vz: number;
  package: string;
  marking: string;
  values: Partial<Record<Field, Printed>>;
  /** tc as printed with min and max (only some layouts print them). */
  tcSpread?: { min: Printed; max: Printed };
}

export interface SeriesData {
  def: SeriesDef;
  device: { pdMax: Printed; tjMax: Printed; rthJA: Printed };
  variants: VariantData[];
}

const MA = 1e-3;

/** Drops float noise from a scaled value (0.043000000000000003 → 0.043). */
const clean = (x: number) => Number(x.toPrecision(12));

function signed(x: number, decimals: number, style: PrintStyle): string {
  const text = fixed(Math.abs(x), decimals);
  if (Number(text) === 0) return text;
  if (x < 0) return `${style.minus}${text}`;
  return style.plusSign ? `+${text}` : text;
}

function current(siA: number, unit: 'mA' | 'µA', style: PrintStyle): Printed {
  const prefix = unit === 'mA' ? 'm' : style.micro;
  const factor = unit === 'mA' ? 1e-3 : 1e-6;
  const value = plain(siA / factor);
  return { value, unit: `${prefix}A`, si: clean(Number(value) * factor) };
}

function ohms(x: number, style: PrintStyle): Printed {
  const value = plain(x);
  return { value, unit: style.ohm, si: Number(value) };
}

function volts(text: string): Printed {
  return { value: text, unit: 'V', si: Number(text) };
}

/** Turns a %/K or mV/K figure as printed into V/K; %/K is relative to the nominal voltage. */
export function tcToSi(value: string, unit: string, vzNomSi: number): number {
  const n = Number(value.replace('−', '-'));
  if (unit === '%/K' || unit === '%/°C') return clean((n / 100) * vzNomSi);
  return clean(n * 1e-3);
}

function tcPrinted(pctPerK: number, vzNom: Printed, style: PrintStyle): Printed {
  if (style.tcUnit === '%/K') {
    const value = signed(pctPerK, 3, style);
    return { value, unit: '%/K', si: tcToSi(value, '%/K', vzNom.si) };
  }
  const mv = (pctPerK / 100) * vzNom.si * 1000;
  const value = signed(mv, Math.abs(mv) < 1 ? 2 : 1, style);
  return { value, unit: style.tcUnit, si: tcToSi(value, style.tcUnit, vzNom.si) };
}

/** Marking codes: two characters, as small packages print them. */
function markingCode(seriesSeed: number, index: number): string {
  const letters = 'ABCDEFHJKLMNPRSTUVWXYZ';
  const first = letters[(seriesSeed + Math.floor(index / 9)) % letters.length];
  return `${first}${(index % 9) + 1}`;
}

export function buildSeries(def: SeriesDef): SeriesData {
  const prng = new Prng(def.seed);
  const s = def.style;
  const pd: Printed = def.pdUnit === 'mW' ? { value: plain(def.pdW * 1000), unit: 'mW', si: def.pdW } : { value: plain(def.pdW), unit: 'W', si: def.pdW };
  const rth = Math.round((def.tjMax - 25) / def.pdW);
  const device = {
    pdMax: pd,
    tjMax: { value: String(def.tjMax), unit: '°C', si: def.tjMax },
    rthJA: { value: String(rth), unit: def.rthUnit, si: rth },
  };
  const variants = def.voltages.map((vz, index): VariantData => {
    const high = vz >= 10 ? 1 : 0;
    const vzNom = volts(fixed(vz, s.vzNomDecimals[high]));
    const vzMin = volts(fixed(vz * (1 - def.tolerance), s.vzDecimals[high]));
    const vzMax = volts(fixed(vz * (1 + def.tolerance), s.vzDecimals[high]));
    const izt = current(def.izt(vz), 'mA', s);
    const zf = def.zFactor * prng.between(0.95, 1.12);
    const values: Partial<Record<Field, Printed>> = { vzMin, vzNom, vzMax, izt };
    values.zzt = ohms(ceilLimit(1.25 * zf * zdTypical(vz, izt.si)), s);
    if (def.izk) {
      const izk = current(def.izk(vz), 'mA', s);
      values.izk = izk;
      values.zzk = ohms(ceilLimit(1.25 * zf * zdTypical(vz, izk.si)), s);
    }
    const vr = def.vr(vz);
    const irUa = leakageBase(vz) * 1e6 * def.irFactor * prng.between(0.8, 1.25) * (vr < leakageVoltage(vz) ? 0.5 : 1);
    const irStep = LEAKAGE_LADDER_UA.find((step) => step >= irUa * (1 - 1e-9)) ?? 200;
    values.irMax = current(irStep * 1e-6, 'µA', s);
    values.vr = volts(plain(vr));
    // Vendors differ a little around the typical curve; the sign stays with the mechanism.
    let pct = tcPercentPerK(vz) * prng.between(0.92, 1.08) + prng.between(-0.002, 0.002);
    if (vz <= 4.7) pct = Math.min(pct, -0.004);
    if (vz >= 6.2) pct = Math.max(pct, 0.01);
    values.tc = tcPrinted(pct, vzNom, s);
    if (def.izm) {
      const izmMa = Math.floor((def.pdW / vzMax.si) * 1000);
      values.izm = { value: String(izmMa), unit: 'mA', si: clean(izmMa * MA) };
    }
    const spread = Math.abs(pct) * 0.6 + 0.02;
    return {
      mpn: def.mpn(vz, index),
      vz,
      package: def.packageOf(vz, index),
      marking: markingCode(def.seed, index),
      values,
      tcSpread: { min: tcPrinted(pct - spread, vzNom, s), max: tcPrinted(pct + spread, vzNom, s) },
    };
  });
  return { def, device, variants };
}

const same = (p: string) => () => p;

export const SERIES: Record<string, SeriesDef> = {
  brz: {
    vendorCode: 'BRK',
    vendor: 'Brackenford Semiconductor',
    series: 'BRZ05',
    file: 'brackenford-brz05-series.pdf',
    mpn: (vz) => `BRZ05-${vzCode(vz)}`,
    packageOf: same('SOD-123'),
    voltages: vzRange(2.4, 24),
    pdW: 0.5,
    pdUnit: 'mW',
    tjMax: 150,
    rthUnit: 'K/W',
    tolerance: 0.05,
    izt: () => 5 * MA,
    izk: () => 0.25 * MA,
    vr: leakageVoltage,
    irFactor: 1,
    zFactor: 1,
    izm: true,
    style: { micro: 'µ', ohm: 'Ω', minus: '−', plusSign: false, tcUnit: 'mV/°C', vzDecimals: [2, 1], vzNomDecimals: [1, 0] },
    seed: 1101,
  },
  lvd: {
    vendorCode: 'LMV',
    vendor: 'Lumenvale Devices',
    series: 'LVD1',
    file: 'lumenvale-lvd1-series.pdf',
    mpn: (vz) => `LVD1-${String(Math.round(vz * 10)).padStart(3, '0')}`,
    packageOf: same('SMA'),
    voltages: vzRange(3.3, 20),
    pdW: 1,
    pdUnit: 'W',
    tjMax: 175,
    rthUnit: '°C/W',
    tolerance: 0.05,
    izt: (vz) => sig(0.22 / vz, 2),
    izk: () => 1 * MA,
    vr: leakageVoltage,
    irFactor: 3,
    zFactor: 0.9,
    izm: true,
    style: { micro: 'μ', ohm: 'Ω', minus: '−', plusSign: true, tcUnit: '%/K', vzDecimals: [2, 1], vzNomDecimals: [1, 0] },
    seed: 2202,
  },
  cbx: {
    vendorCode: 'CRB',
    vendor: 'Corriebank Electronics',
    series: 'CBX3',
    file: 'corriebank-cbx3-series.pdf',
    mpn: (vz) => `CBX3-${vz >= 10 ? String(vz) : vz.toFixed(1)}`,
    packageOf: same('SOD-323'),
    voltages: vzRange(2.4, 11),
    pdW: 0.3,
    pdUnit: 'mW',
    tjMax: 150,
    rthUnit: 'K/W',
    tolerance: 0.05,
    izt: () => 5 * MA,
    vr: leakageVoltage,
    irFactor: 1.5,
    zFactor: 1.1,
    izm: false,
    style: { micro: 'u', ohm: 'ohm', minus: '-', plusSign: false, tcUnit: 'mV/K', vzDecimals: [2, 2], vzNomDecimals: [1, 0] },
    seed: 3303,
  },
  amzr: {
    vendorCode: 'ALD',
    vendor: 'Aldmoor Components',
    series: 'AM-ZR',
    file: 'aldmoor-am-zr-series.pdf',
    mpn: (vz) => `AM-ZR${vzCode(vz)}`,
    packageOf: same('DO-41'),
    voltages: [3.3, 4.7, 5.1, 5.6, 6.2, 8.2, 12, 15],
    pdW: 1.3,
    pdUnit: 'W',
    tjMax: 175,
    rthUnit: 'K/W',
    tolerance: 0.05,
    izt: (vz) => sig(0.26 / vz, 2),
    izk: () => 1 * MA,
    vr: leakageVoltage,
    irFactor: 4,
    zFactor: 0.85,
    izm: true,
    style: { micro: 'μ', ohm: '\u2126', minus: '−', plusSign: true, tcUnit: '%/K', vzDecimals: [2, 1], vzNomDecimals: [1, 0] },
    seed: 4404,
  },
  nmz: {
    vendorCode: 'NTC',
    vendor: 'Nettlecombe Microdevices',
    series: 'NMZ',
    file: 'nettlecombe-nmz-series.pdf',
    mpn: (vz) => `NMZ-${vz >= 10 ? String(vz) : `0${vzCode(vz)}`}`,
    packageOf: same('SOT-23'),
    voltages: [3.6, 5.1, 6.8, 10, 18, 24],
    pdW: 0.35,
    pdUnit: 'mW',
    tjMax: 150,
    rthUnit: 'K/W',
    tolerance: 0.02,
    izt: () => 5 * MA,
    izk: () => 0.25 * MA,
    // The low-voltage types give leakage at 1 V only, lower than most specs ask for at 5 V.
    vr: (vz) => (vz < 6.2 ? 1 : leakageVoltage(vz)),
    irFactor: 1,
    zFactor: 1.05,
    izm: true,
    style: { micro: 'µ', ohm: 'Ω', minus: '−', plusSign: true, tcUnit: 'mV/°C', vzDecimals: [2, 2], vzNomDecimals: [2, 2] },
    seed: 5505,
  },
  qhz: {
    vendorCode: 'QRY',
    vendor: 'Quarryhill Semitech',
    series: 'QHZ',
    file: 'quarryhill-qhz-series.pdf',
    mpn: (vz, i) => `QHZ${vzCode(vz)}A${i % 2 === 1 ? 'F' : ''}`,
    packageOf: (_vz, i) => (i % 2 === 1 ? 'SOD-123F' : 'SOD-123'),
    voltages: [4.7, 5.1, 5.6, 6.2, 6.8, 8.2, 10, 12, 15, 24],
    pdW: 0.5,
    pdUnit: 'mW',
    tjMax: 150,
    rthUnit: 'K/W',
    tolerance: 0.05,
    izt: () => 5 * MA,
    izk: () => 0.5 * MA,
    vr: leakageVoltage,
    irFactor: 1,
    zFactor: 0.95,
    izm: false,
    style: { micro: 'µ', ohm: 'Ω', minus: '−', plusSign: false, tcUnit: 'mV/°C', vzDecimals: [2, 1], vzNomDecimals: [1, 0] },
    seed: 6606,
  },
  tpz: {
    vendorCode: 'TVR',
    vendor: 'Tevorrow Power Devices',
    series: 'TPZ15',
    file: 'tevorrow-tpz15-series.pdf',
    mpn: (vz) => `TPZ15-${vzCode(vz)}`,
    packageOf: same('SMB'),
    voltages: vzRange(7.5, 36),
    pdW: 1.5,
    pdUnit: 'W',
    tjMax: 150,
    rthUnit: '°C/W',
    tolerance: 0.05,
    izt: (vz) => sig(0.375 / vz, 2),
    izk: () => 1 * MA,
    vr: leakageVoltage,
    irFactor: 5,
    zFactor: 0.9,
    izm: true,
    style: { micro: 'µ', ohm: 'Ω', minus: '−', plusSign: true, tcUnit: 'mV/°C', vzDecimals: [2, 2], vzNomDecimals: [1, 0] },
    seed: 7707,
  },
  odw: {
    vendorCode: 'OST',
    vendor: 'Ostrander Diode Works',
    series: 'ODW',
    file: 'ostrander-odw-series.pdf',
    mpn: (vz) => `ODW${Math.round(vz)}`,
    packageOf: same('DO-35'),
    voltages: vzRange(10, 47),
    pdW: 0.5,
    pdUnit: 'W',
    tjMax: 175,
    rthUnit: 'K/W',
    tolerance: 0.05,
    izt: (vz) => (vz <= 24 ? 5 * MA : 2 * MA),
    izk: () => 0.25 * MA,
    vr: leakageVoltage,
    irFactor: 1,
    zFactor: 1.15,
    izm: false,
    style: { micro: 'u', ohm: 'ohm', minus: '-', plusSign: true, tcUnit: 'mV/°C', vzDecimals: [2, 1], vzNomDecimals: [1, 0] },
    seed: 8808,
  },
};
