import { E24_VZ, leakageVoltage, vzCode } from '../diode-physics';
import { plain, sig } from '../numbers';
import { Prng } from '../prng';
import { buildSeries, PrintStyle, SeriesDef, tcToSi } from '../series';
import { Field } from '../types';
import { LayoutChoices, partPrefix } from './choices';

/**
 * The invented parts of one random datasheet: values come from the same physics as the
 * hand-made fixtures (buildSeries: VZ, IZT, ZZT, IZK, ZZK, IR at VR, TC sign by mechanism).
 * Values keep a decimal point here; the drawing prints them with the vendor's decimal sign.
 */

export interface Val {
  value: string;
  unit: string;
  si: number;
  /** Not printed as such: derived from the tolerance letter's legend. */
  derived?: 'tolerance-suffix';
}

export interface PackageModel {
  name: string;
  pd: Val;
  tj: Val;
  rth: Val;
  /** Derating above 25 °C, mW/K: a number near the ratings that is not one of them. */
  derating: Val;
}

export interface PartModel {
  /** The full part number (with tolerance letter when the legend gives the tolerance). */
  mpn: string;
  /** The part number as the characteristics print it (without tolerance letter). */
  printedMpn: string;
  series: number;
  pkg: PackageModel;
  vz: number;
  marking: string;
  values: Partial<Record<Field, Val>>;
}

export interface SeriesModel {
  name: string;
  /** A constant test current when conditions stand in a header or title. */
  iztConst?: Val;
  izkConst?: Val;
  hasIzk: boolean;
  hasIzm: boolean;
  tolerancePct: number;
  /** Tolerance letters and their ± % (suffix-legend only). */
  legend?: Array<{ letter: string; pct: number }>;
  packages: PackageModel[];
  /** One printed row per base part (the tolerance letters share it). */
  rows: PartModel[][];
}

export interface DatasheetModel {
  vendor: string;
  title: string;
  docId: string;
  series: SeriesModel[];
  parts: PartModel[];
  packages: PackageModel[];
}

const clean = (x: number) => Number(x.toPrecision(12));
const MA = 1e-3;

function packageModel(name: string, pdW: number, tj: number, rthUnit: string): PackageModel {
  const rth = Math.round((tj - 25) / pdW);
  const derating = Math.round((pdW * 1000 * 10) / (tj - 25)) / 10;
  return {
    name,
    pd: pdW < 1 ? { value: plain(pdW * 1000), unit: 'mW', si: pdW } : { value: plain(pdW), unit: 'W', si: pdW },
    tj: { value: String(tj), unit: '°C', si: tj },
    rth: { value: String(rth), unit: rthUnit, si: rth },
    derating: { value: plain(derating), unit: 'mW/K', si: derating * 1e-3 },
  };
}

const SMALL_PACKAGES = ['SOD-123', 'SOD-323', 'SOT-23', 'DO-35', 'SOD-523', 'MiniMELF'];
const POWER_PACKAGES = ['SMA', 'SMB', 'DO-41', 'SOD-123F', 'SOD-323F'];

function run(prng: Prng, count: number, from: number, to: number): number[] {
  const pool = E24_VZ.filter((v) => v >= from && v <= to);
  const n = Math.min(count, pool.length);
  const start = prng.int(0, pool.length - n);
  return pool.slice(start, start + n);
}

export function buildModel(prng: Prng, c: LayoutChoices, vendor: string): DatasheetModel {
  const perPart = c.arrangement === 'part-per-page' ? [2, 4] : c.arrangement === 'rows' || c.arrangement === 'transposed' ? [5, 12] : [3, 6];
  const headerConditions = c.conditions === 'header' || c.conditions === 'title';
  const style: PrintStyle = {
    micro: c.micro,
    ohm: c.ohm,
    minus: prng.pick(['−', '-'] as const),
    plusSign: prng.next() < 0.4,
    tcUnit: c.tcUnit === 'mV/K' || c.tcUnit === 'mV/°C' ? c.tcUnit : '%/K',
    vzDecimals: prng.pick([
      [2, 1],
      [2, 2],
      [1, 1],
    ] as Array<[number, number]>),
    vzNomDecimals: prng.pick([
      [1, 0],
      [1, 1],
      [2, 2],
    ] as Array<[number, number]>),
  };
  const small = packageModel(prng.pick(SMALL_PACKAGES), prng.pick([0.2, 0.25, 0.3, 0.35, 0.5]), prng.pick([150, 150, 175]), c.rthUnit);
  let power = packageModel(prng.pick(POWER_PACKAGES), prng.pick([1, 1.3, 1.5, 2, 3]), prng.pick([150, 175]), c.rthUnit);
  const seriesPkgs: PackageModel[][] =
    c.series === 2
      ? c.maxRatings === 'once'
        ? [[small], [small]]
        : [[small], [power]]
      : c.maxRatings === 'per-package'
        ? [[small, (power = packageModel(prng.pick(SMALL_PACKAGES.filter((p) => p !== small.name)), prng.pick([0.4, 0.6, 1]), small.tj.si, c.rthUnit))]]
        : [[prng.next() < 0.6 ? small : power]];
  const firstPrefix = partPrefix(prng, vendor);
  const codeStyle = prng.pick(['vcode', 'digits'] as const);
  const sep = prng.pick(['', '-'] as const);
  const series: SeriesModel[] = [];
  const parts: PartModel[] = [];
  for (let s = 0; s < c.series; s++) {
    const pkgs = seriesPkgs[s];
    const pdW = pkgs[0].pd.si;
    let prefix = s === 0 ? firstPrefix : partPrefix(prng, vendor);
    while (s > 0 && prefix === series[0].name) prefix = partPrefix(prng, vendor);
    const iztConstMa = s === 0 ? prng.pick([5, 5, 2, 1]) : prng.pick([10, 20, 2.5, 0.5]);
    const iztConst = headerConditions || prng.next() < 0.5;
    const hasIzk = prng.next() < 0.8;
    const izkMa = prng.pick([0.25, 0.5, 1]);
    const count = prng.int(perPart[0], perPart[1]) - (c.tolerance === 'suffix-legend' ? 2 : 0);
    const lowest = prng.pick([2.4, 3.3, 4.7, 6.8]);
    const voltages = run(prng, Math.max(2, count), lowest, 75);
    const code = (vz: number) => (codeStyle === 'vcode' ? vzCode(vz) : String(Math.round(vz * 10)).padStart(3, '0'));
    const pkgLetter = (i: number) => (pkgs.length > 1 && i % 2 === 1 ? 'W' : '');
    const def: SeriesDef = {
      vendorCode: prefix,
      vendor,
      series: prefix,
      file: `${prefix.toLowerCase()}.pdf`,
      mpn: (vz, i) => `${prefix}${sep}${code(vz)}${pkgLetter(i)}`,
      packageOf: (_vz, i) => pkgs[pkgs.length > 1 ? i % 2 : 0].name,
      voltages,
      pdW,
      pdUnit: pdW < 1 ? 'mW' : 'W',
      tjMax: pkgs[0].tj.si,
      rthUnit: c.rthUnit,
      tolerance: prng.pick([0.02, 0.05]),
      izt: iztConst ? () => iztConstMa * MA : (vz) => sig((0.25 * pdW) / vz, 2),
      izk: hasIzk ? () => izkMa * MA : undefined,
      vr: leakageVoltage,
      irFactor: prng.between(0.8, 4),
      zFactor: prng.between(0.85, 1.2),
      izm: prng.next() < 0.6,
      style,
      seed: prng.int(1, 1e9),
    };
    const data = buildSeries(def);
    const legend =
      c.tolerance === 'suffix-legend'
        ? prng.pick([
            [
              { letter: 'B', pct: 2 },
              { letter: 'C', pct: 5 },
            ],
            [
              { letter: 'A', pct: 1 },
              { letter: 'B', pct: 2 },
              { letter: 'C', pct: 5 },
            ],
            [
              { letter: 'J', pct: 5 },
              { letter: 'K', pct: 10 },
            ],
          ])
        : undefined;
    const model: SeriesModel = {
      name: prefix,
      iztConst: iztConst ? { value: plain(iztConstMa), unit: 'mA', si: clean(iztConstMa * MA) } : undefined,
      izkConst: hasIzk ? { value: plain(izkMa), unit: 'mA', si: clean(izkMa * MA) } : undefined,
      hasIzk,
      hasIzm: def.izm,
      tolerancePct: def.tolerance * 100,
      legend,
      packages: pkgs,
      rows: [],
    };
    data.variants.forEach((v, i) => {
      const values: Partial<Record<Field, Val>> = { ...v.values };
      if (c.tcUnit === '%/°C' && values.tc) values.tc = { ...values.tc, unit: '%/°C' };
      if (values.tc && values.vzNom) values.tc.si = tcToSi(values.tc.value, values.tc.unit, values.vzNom.si);
      const pkg = pkgs[pkgs.length > 1 ? i % 2 : 0];
      const row: PartModel[] = [];
      if (legend) {
        delete values.vzMin;
        delete values.vzMax;
        const nom = values.vzNom!;
        for (const { letter, pct } of legend) {
          const lo = clean(nom.si * (1 - pct / 100));
          const hi = clean(nom.si * (1 + pct / 100));
          row.push({
            mpn: `${v.mpn}${letter}`,
            printedMpn: v.mpn,
            series: s,
            pkg,
            vz: v.vz,
            marking: v.marking,
            values: {
              ...values,
              vzMin: { value: plain(lo), unit: 'V', si: lo, derived: 'tolerance-suffix' },
              vzMax: { value: plain(hi), unit: 'V', si: hi, derived: 'tolerance-suffix' },
            },
          });
        }
      } else row.push({ mpn: v.mpn, printedMpn: v.mpn, series: s, pkg, vz: v.vz, marking: v.marking, values });
      model.rows.push(row);
      parts.push(...row);
    });
    series.push(model);
  }
  const packages = [...new Set(series.flatMap((s) => s.packages))];
  const title = series.length === 1 ? `${series[0].name} series` : `${series[0].name} and ${series[1].name} series`;
  return { vendor, title, docId: `DS-${prng.int(100, 9999)}`, series, parts, packages };
}
