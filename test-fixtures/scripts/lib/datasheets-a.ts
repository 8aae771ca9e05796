import { AnswerRecorder } from './answers';
import { cover, dimensionTable, infoLines, notes, ratingTable, seriesTable, SeriesColumn, spans, val } from './layout-parts';
import { SeriesData, VariantData } from './series';
import { PAGE, Sheet } from './sheet';
import { AnswerKey } from './types';

/**
 * Series-table datasheets: one row per part number, units in the column headers.
 * Brackenford (one page, three-line header), Lumenvale (continued with the header
 * repeated, %/K), Corriebank (continued without the header, ASCII units, no knee point).
 */

export interface Built {
  pdf: Buffer;
  answers: AnswerKey;
}

const all = (d: SeriesData) => d.variants.map((_, i) => i);
const mpn = (v: VariantData) => v.mpn;

export async function brackenford(d: SeriesData): Promise<Built> {
  const title = 'BRZ05 series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'DS-0412', revision: 'C' });
  const rec = new AnswerRecorder(d);
  const s = d.def.style;
  let y = cover(sheet, {
    title,
    subtitle: '500 mW surface-mount voltage regulator diodes, SOD-123',
    description:
      'Planar silicon regulator diodes in a small moulded package for board-level voltage references, ' +
      'clamps and bias supplies. The series covers the E24 values from 2.4 V to 24 V with a tolerance of ±5 % ' +
      'at the test current. Low-voltage types regulate by tunnelling and have a negative temperature ' +
      'coefficient; types above about 6 V break down by avalanche and drift upwards with temperature.',
    features: [
      'Zener voltages from 2.4 V to 24 V (E24), tolerance ±5 %',
      'Total power dissipation up to 500 mW',
      'Low dynamic impedance from 6.2 V upwards',
      'Matte tin terminations, halogen-free moulding compound',
    ],
    applications: ['Reference and bias voltages', 'Gate and input clamps', 'Shunt regulators for small loads'],
  });
  y = infoLines(sheet, y, 'Mechanical data', [
    'Case: SOD-123, moulded plastic, flame-retardant compound',
    'Terminals: matte tin plated, suitable for reflow soldering',
    'Polarity: the band marks the cathode',
    'Weight: about 10 mg',
  ]);
  rec.packagePage(all(d), sheet.page);
  y = ratingTable(sheet, rec, y, 'Absolute maximum ratings (Tamb = 25 °C unless otherwise specified)', [
    { label: 'Total power dissipation 1)', symbol: 'Ptot', value: d.device.pdMax.value, unit: d.device.pdMax.unit, field: 'pdMax' },
    { label: 'Non-repetitive peak reverse power', symbol: 'PZSM', condition: 'tp = 100 µs, square pulse', value: '30', unit: 'W' },
    { label: 'Forward current', symbol: 'IF', value: '200', unit: 'mA' },
    { label: 'Junction temperature', symbol: 'Tj', value: d.device.tjMax.value, unit: '°C', field: 'tjMax' },
    { label: 'Storage temperature range', symbol: 'Tstg', value: '−65 to +150', unit: '°C' },
  ]);
  y = ratingTable(sheet, rec, y, 'Thermal characteristics', [
    { label: 'Thermal resistance junction to ambient 1)', symbol: 'RthJA', value: d.device.rthJA.value, unit: d.device.rthJA.unit, field: 'rthJA' },
    { label: 'Thermal resistance junction to lead', symbol: 'RthJL', value: '110', unit: 'K/W' },
  ]);
  notes(sheet, y, ['1) Device mounted on an FR4 board, 1.6 mm thick, with the recommended minimum pad layout.']);

  sheet.addPage();
  y = sheet.heading('Electrical characteristics', PAGE.top);
  sheet.text('Tamb = 25 °C unless otherwise specified', PAGE.left, y - 4, { size: 8 });
  const micro = `${s.micro}A`;
  const columns: SeriesColumn[] = [
    { width: 56, align: 'left', cell: mpn },
    { width: 34, align: 'center', cell: (v) => v.marking },
    { width: 32, align: 'center', cell: val('vzMin'), field: 'vzMin' },
    { width: 32, align: 'center', cell: val('vzNom'), field: 'vzNom' },
    { width: 32, align: 'center', cell: val('vzMax'), field: 'vzMax' },
    { width: 30, align: 'center', cell: val('izt'), field: 'izt' },
    { width: 32, align: 'center', cell: val('zzt'), field: 'zzt' },
    { width: 30, align: 'center', cell: val('izk'), field: 'izk' },
    { width: 34, align: 'center', cell: val('zzk'), field: 'zzk' },
    { width: 32, align: 'center', cell: val('irMax'), field: 'irMax' },
    { width: 30, align: 'center', cell: val('vr'), field: 'vr' },
    { width: 40, align: 'center', cell: val('tc'), field: 'tc' },
    { width: 34, align: 'center', cell: val('izm'), field: 'izm' },
  ];
  y = seriesTable(sheet, rec, {
    columns,
    rows: all(d),
    y: y + 14,
    repeatHeader: true,
    header: [
      spans(['Type', 'Marking', ['VZ at IZT 2)', 2, 4], 'IZT', 'ZZT', 'IZK', 'ZZK', ['IR at VR', 9, 10], 'αVZ', 'IZM 3)']),
      spans(['', '', 'min', 'nom', 'max', '', 'max', '', 'max', 'max', '', 'typ', 'max']),
      spans(['', '', '(V)', '(V)', '(V)', '(mA)', `(${s.ohm})`, '(mA)', `(${s.ohm})`, `(${micro})`, '(V)', `(${s.tcUnit})`, '(mA)']),
    ],
  });
  notes(sheet, y, [
    '2) Measured with pulses, tp = 20 ms, so that the junction stays near the ambient temperature.',
    '3) IZM follows from Ptot and VZ max; the real limit depends on the mounting and the ambient temperature.',
    'Dynamic impedances are measured with a 1 kHz signal of 10 % of the test current superimposed on it.',
  ]);

  sheet.addPage();
  y = dimensionTable(
    sheet,
    PAGE.top,
    'Package outline SOD-123',
    [
      ['A', '0.95', '1.35'],
      ['A1', '0.00', '0.10'],
      ['b', '0.45', '0.65'],
      ['c', '0.08', '0.15'],
      ['D', '1.40', '1.80'],
      ['E', '2.55', '2.85'],
      ['HE', '3.55', '3.85'],
    ],
    'Recommended pad layout: two pads of 0.9 mm × 1.2 mm at 3.0 mm pitch.',
  );
  infoLines(sheet, y + 10, 'Ordering information', [
    'Order as BRZ05-xVx-T7 for 3000 pieces on a 7 in reel, or BRZ05-xVx-T13 for 10 000 pieces on a 13 in reel.',
    'Example: BRZ05-5V1-T7 is the 5.1 V type on a 7 in reel.',
  ]);
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('series table, three-line header with units, one page', title, sheet.page) };
}

export async function lumenvale(d: SeriesData): Promise<Built> {
  const title = 'LVD1 series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'LV-2291', revision: '4' });
  const rec = new AnswerRecorder(d);
  const s = d.def.style;
  let y = cover(sheet, {
    title,
    subtitle: '1 W voltage regulator diodes in SMA',
    description:
      'Glass-passivated regulator diodes for supply rails and protection. The flat SMA body carries 1 W at an ' +
      'ambient of 25 °C on the reference board; derate linearly to zero at the maximum junction temperature.',
    features: ['VZ from 3.3 V to 20 V, ±5 %', '1 W total power dissipation', 'Junction temperature up to 175 °C', 'Glass-passivated die'],
    applications: ['Auxiliary rails from 12 V and 24 V buses', 'Clamping of relay and solenoid drivers', 'Bias supplies for gate drivers'],
  });
  y = infoLines(sheet, y, 'Mechanical data', ['Package: SMA (DO-214AC), moulded plastic over a passivated die', 'Marking: type number and date code']);
  rec.packagePage(all(d), sheet.page);
  y = ratingTable(sheet, rec, y, 'Limiting values', [
    { label: 'Total power dissipation', symbol: 'Ptot', condition: 'Tamb ≤ 25 °C, note 1', value: d.device.pdMax.value, unit: 'W', field: 'pdMax' },
    { label: 'Junction temperature', symbol: 'Tj', value: d.device.tjMax.value, unit: '°C', field: 'tjMax' },
    { label: 'Storage temperature', symbol: 'Tstg', value: '−65 … +175', unit: '°C' },
  ]);
  y = ratingTable(sheet, rec, y, 'Thermal characteristics', [
    {
      label: 'Thermal resistance from junction to ambient',
      symbol: 'RθJA',
      condition: 'note 1',
      value: d.device.rthJA.value,
      unit: d.device.rthJA.unit,
      field: 'rthJA',
    },
    { label: 'Thermal resistance from junction to lead', symbol: 'RθJL', condition: 'at the cathode tab', value: '30', unit: '°C/W' },
  ]);
  const micro = `${s.micro}A`;
  y = sheet.heading('Electrical characteristics', y + 4);
  y = seriesTable(sheet, rec, {
    columns: [
      { width: 56, align: 'left', cell: mpn },
      { width: 36, align: 'right', cell: val('vzMin'), field: 'vzMin' },
      { width: 36, align: 'right', cell: val('vzNom'), field: 'vzNom' },
      { width: 36, align: 'right', cell: val('vzMax'), field: 'vzMax' },
      { width: 34, align: 'right', cell: val('izt'), field: 'izt' },
      { width: 34, align: 'right', cell: val('zzt'), field: 'zzt' },
      { width: 32, align: 'right', cell: val('izk'), field: 'izk' },
      { width: 36, align: 'right', cell: val('zzk'), field: 'zzk' },
      { width: 34, align: 'right', cell: val('irMax'), field: 'irMax' },
      { width: 32, align: 'right', cell: val('vr'), field: 'vr' },
      { width: 40, align: 'right', cell: val('tc'), field: 'tc' },
      { width: 36, align: 'right', cell: val('izm'), field: 'izm' },
    ],
    rows: all(d),
    y,
    rowHeight: 13,
    repeatHeader: true,
    continuedCaption: 'Electrical characteristics (continued)',
    header: [
      spans(['Part number', 'VZ min', 'VZ nom', 'VZ max', 'IZT', 'ZZT max', 'IZK', 'ZZK max', 'IR max', 'VR', 'TC typ', 'IZM']),
      spans(['', '[V]', '[V]', '[V]', '[mA]', `[${s.ohm}]`, '[mA]', `[${s.ohm}]`, `[${micro}]`, '[V]', '[%/K]', '[mA]']),
    ],
  });
  y = notes(sheet, y, ['VZ and ZZT at IZT, ZZK at IZK, IR at VR. TC is typical, between 25 °C and 125 °C.']);
  sheet.addPage();
  y = notes(
    sheet,
    PAGE.top,
    [
      'Note 1: mounted on a 40 mm × 40 mm FR4 board with 1 oz copper and 25 mm² pads.',
      'Derating: the power rating falls linearly from 1 W at 25 °C to zero at 175 °C.',
    ],
    8.5,
  );
  dimensionTable(
    sheet,
    y + 10,
    'Package outline SMA (DO-214AC)',
    [
      ['A', '1.95', '2.40'],
      ['b', '1.25', '1.65'],
      ['D', '2.29', '2.92'],
      ['E', '4.00', '4.60'],
      ['HE', '4.80', '5.60'],
    ],
    'All dimensions in millimetres.',
  );
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('series table continued across a page break, header repeated, TC in %/K', title, sheet.page) };
}

export async function corriebank(d: SeriesData): Promise<Built> {
  const title = 'CBX3 series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'CB-DS-118', revision: '2.1' });
  const rec = new AnswerRecorder(d);
  let y = cover(sheet, {
    title,
    subtitle: '300 mW regulator diodes, SOD-323',
    description:
      'Small-signal regulator diodes for portable equipment. Values are guaranteed at the stated test current; ' +
      'no knee point is specified for this series.',
    features: ['Vz 2.4 V to 11 V in the E24 series', 'Ptot 300 mW', 'Very small SOD-323 package', 'Tight tolerance over the whole range'],
    applications: ['Battery-powered references', 'Input protection of small-signal stages', 'Level shifting'],
  });
  y = infoLines(sheet, y, 'Mechanical data', ['Case: SOD-323 plastic', 'Terminals: tin plated', 'Polarity: cathode band', 'Weight: 5 mg']);
  rec.packagePage(all(d), sheet.page);
  y = ratingTable(sheet, rec, y, 'Absolute maximum ratings', [
    { label: 'Power dissipation', symbol: 'Ptot', condition: 'Tamb = 25 C', value: d.device.pdMax.value, unit: 'mW', field: 'pdMax' },
    { label: 'Junction temperature', symbol: 'Tj', value: d.device.tjMax.value, unit: 'C', field: 'tjMax', printedAs: { unit: 'C' } },
    { label: 'Storage temperature', symbol: 'Tstg', value: '-55 to +150', unit: 'C' },
    { label: 'Thermal resistance junction to ambient', symbol: 'RthJA', value: d.device.rthJA.value, unit: 'K/W', field: 'rthJA' },
  ]);
  y = infoLines(sheet, y, 'Handling', [
    'These diodes are sensitive to electrostatic discharge above 2 kV (human body model); handle with the usual precautions.',
    'Keep reels sealed until use; bake at 60 C for 24 h if the humidity indicator has changed colour.',
  ]);
  y = sheet.heading('Electrical characteristics at Tamb = 25 C', y + 2);
  y = seriesTable(sheet, rec, {
    columns: [
      { width: 52, align: 'left', cell: mpn },
      { width: 30, align: 'center', cell: (v) => v.marking },
      { width: 34, align: 'center', cell: val('vzMin'), field: 'vzMin' },
      { width: 34, align: 'center', cell: val('vzNom'), field: 'vzNom' },
      { width: 34, align: 'center', cell: val('vzMax'), field: 'vzMax' },
      { width: 34, align: 'center', cell: val('izt'), field: 'izt' },
      { width: 42, align: 'center', cell: val('zzt'), field: 'zzt' },
      { width: 36, align: 'center', cell: val('irMax'), field: 'irMax' },
      { width: 34, align: 'center', cell: val('vr'), field: 'vr' },
      { width: 44, align: 'center', cell: val('tc'), field: 'tc' },
    ],
    rows: all(d),
    y,
    rowHeight: 13,
    repeatHeader: false,
    header: [
      spans(['Device', 'Code', ['Vz @ Izt', 2, 4], 'Izt', 'Zzt @ Izt', ['Ir @ Vr', 7, 8], 'TC']),
      spans(['', '', 'min', 'nom', 'max', '', 'max', 'max', '', 'typ']),
      spans(['', '', '(V)', '(V)', '(V)', '(mA)', '(ohm)', '(uA)', '(V)', '(mV/K)']),
    ],
  });
  notes(sheet, y, [
    'Notes: pulse measurement, tp = 10 ms. TC is a typical value at Izt.',
    'Knee impedance is not specified for this series; use a separate qualification measurement if needed.',
  ]);
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('series table continued across a page break, header not repeated, ASCII units, no knee point', title, sheet.page) };
}
