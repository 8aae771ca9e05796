import { AnswerRecorder } from './answers';
import { Built } from './datasheets-a';
import { cover, dimensionTable, infoLines, notes, ratingTable, seriesTable, spans, withUnit } from './layout-parts';
import { SeriesData } from './series';
import { PAGE, Sheet, TableColumn } from './sheet';
import { Field } from './types';

/**
 * Datasheets whose values are not in one series table: Aldmoor (a key–value block per
 * part, units after the values), Nettlecombe (a min/typ/max table per part on its own
 * page, test conditions in a column) and Quarryhill (one table, units in the cells,
 * package per row, leakage only at 1 V).
 */

const all = (d: SeriesData) => d.variants.map((_, i) => i);

export async function aldmoor(d: SeriesData): Promise<Built> {
  const title = 'AM-ZR series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'AC-ZR-07', revision: 'B' });
  const rec = new AnswerRecorder(d);
  let y = cover(sheet, {
    title,
    subtitle: '1.3 W axial regulator diodes, DO-41',
    description:
      'Axial-lead regulator diodes for mains-derived auxiliary supplies and industrial inputs. The characteristics ' +
      'of each type are listed on the following pages, one block per type.',
    features: ['1.3 W at Tamb = 25 °C with 10 mm leads', 'Junction temperature 175 °C', 'Tight knee for stable bias at low current'],
    applications: ['Auxiliary supply regulation', 'Relay-coil and input clamps'],
  });
  y = infoLines(sheet, y, 'Mechanical data', ['Case: DO-41, moulded plastic, axial leads', 'Lead finish: tin over copper']);
  rec.packagePage(all(d), sheet.page);
  ratingTable(sheet, rec, y, 'Absolute maximum ratings', [
    { label: 'Power dissipation', symbol: 'Ptot', condition: 'lead length 10 mm, Tamb = 25 °C', value: d.device.pdMax.value, unit: 'W', field: 'pdMax' },
    { label: 'Non-repetitive peak reverse power', symbol: 'PZSM', condition: 'tp = 100 μs', value: '60', unit: 'W' },
    { label: 'Junction temperature', symbol: 'Tj', value: d.device.tjMax.value, unit: '°C', field: 'tjMax' },
    { label: 'Storage temperature range', symbol: 'Tstg', value: '−65 to +175', unit: '°C' },
    {
      label: 'Thermal resistance junction to ambient',
      symbol: 'RthJA',
      condition: 'lead length 10 mm',
      value: d.device.rthJA.value,
      unit: 'K/W',
      field: 'rthJA',
    },
    { label: 'Thermal resistance junction to lead', symbol: 'RthJL', condition: '4 mm from the body', value: '40', unit: 'K/W' },
  ]);

  const rows: Array<[string, string, Field, string]> = [
    ['Zener voltage, minimum', 'VZmin', 'vzMin', 'at IZT'],
    ['Zener voltage, nominal', 'VZnom', 'vzNom', 'at IZT'],
    ['Zener voltage, maximum', 'VZmax', 'vzMax', 'at IZT'],
    ['Zener test current', 'IZT', 'izt', ''],
    ['Dynamic impedance', 'ZZT', 'zzt', 'at IZT, f = 1 kHz'],
    ['Knee current', 'IZK', 'izk', ''],
    ['Knee impedance', 'ZZK', 'zzk', 'at IZK, f = 1 kHz'],
    ['Reverse current', 'IR', 'irMax', 'at VR'],
    ['Temperature coefficient', 'αVZ', 'tc', 'at IZT, typical'],
    ['Maximum regulator current', 'IZM', 'izm', 'Tamb = 25 °C'],
  ];
  const limits: ReadonlySet<Field> = new Set(['zzt', 'zzk', 'irMax']);
  d.variants.forEach((v, i) => {
    const top = i % 2 === 0;
    if (top) sheet.addPage();
    let cy = top ? PAGE.top : 420;
    sheet.text(v.mpn, PAGE.left, cy, { size: 12, bold: true });
    cy += 20;
    sheet.text(`Regulator diode, ${v.values.vzNom!.value} V nominal`, PAGE.left, cy, { size: 9 });
    cy += 14;
    sheet.text('Characteristics at Tamb = 25 °C unless otherwise noted', PAGE.left, cy, { size: 8 });
    cy += 16;
    for (const [label, symbol, field, cond] of rows) {
      const p = v.values[field]!;
      const value = `${limits.has(field) ? '≤ ' : ''}${p.value} ${p.unit}`;
      const condition = field === 'irMax' ? `at VR = ${v.values.vr!.value} V` : cond;
      sheet.text(label, PAGE.left, cy, { size: 9 });
      sheet.text(symbol, 230, cy, { size: 9 });
      sheet.text(value, 300, cy, { size: 9 });
      sheet.text(condition, 390, cy, { size: 8 });
      rec.value(i, field, sheet.page);
      if (field === 'irMax') rec.value(i, 'vr', sheet.page);
      cy += 14;
    }
    sheet.rule(PAGE.left, PAGE.right, cy + 4, 0.5);
  });
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('key–value block per part, units after the values, μ and Ω (ohm sign), TC in %/K', title, sheet.page) };
}

export async function nettlecombe(d: SeriesData): Promise<Built> {
  const title = 'NMZ series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'NM-0093', revision: '1.3' });
  const rec = new AnswerRecorder(d);
  let y = cover(sheet, {
    title,
    subtitle: 'Precision regulator diodes, ±2 %, SOT-23',
    description:
      'Regulator diodes with a ±2 % voltage tolerance for references and comparator thresholds. Each type has its own ' +
      'characteristics page with minimum, typical and maximum values.',
    features: ['Tolerance ±2 % at IZ = 5 mA', 'Ptot 350 mW', 'SOT-23, pin 3 is the cathode'],
  });
  y = infoLines(sheet, y, 'Mechanical data', ['Package: SOT-23, three leads, pin 3 cathode, pin 2 not connected']);
  rec.packagePage(all(d), sheet.page);
  ratingTable(
    sheet,
    rec,
    y,
    'Absolute maximum ratings',
    [
      { label: 'Total power dissipation', symbol: 'Ptot', condition: 'Tamb ≤ 25 °C, note 1', value: ['', d.device.pdMax.value], unit: 'mW', field: 'pdMax' },
      { label: 'Junction temperature', symbol: 'Tj', value: ['', d.device.tjMax.value], unit: '°C', field: 'tjMax' },
      { label: 'Storage temperature', symbol: 'Tstg', value: ['−65', '+150'], unit: '°C' },
      { label: 'Thermal resistance junction to ambient', symbol: 'RthJA', condition: 'note 1', value: ['', d.device.rthJA.value], unit: 'K/W', field: 'rthJA' },
    ],
    true,
  );
  const columns: TableColumn[] = [
    { width: 130, align: 'left' },
    { width: 40, align: 'center' },
    { width: 130, align: 'left' },
    { width: 40, align: 'center' },
    { width: 40, align: 'center' },
    { width: 40, align: 'center' },
    { width: 45, align: 'center' },
  ];
  d.variants.forEach((v, i) => {
    sheet.addPage();
    let cy = PAGE.top;
    sheet.text(v.mpn, PAGE.left, cy, { size: 13, bold: true });
    sheet.text(`${v.values.vzNom!.value} V regulator diode`, 200, cy + 2, { size: 10 });
    cy += 26;
    cy = sheet.heading('Electrical characteristics, Tamb = 25 °C', cy, 10);
    const header = ['Parameter', 'Symbol', 'Conditions', 'Min', 'Typ', 'Max', 'Unit'].map((text, c) => ({ text, from: c, to: c }));
    cy = sheet.tableHeader(PAGE.left, cy, columns, [header], { size: 8, bold: true, lineHeight: 12 });
    const x = v.values;
    const izt = `IZ = ${x.izt!.value} mA`;
    const tcMin = v.tcSpread!.min.value;
    const tcMax = v.tcSpread!.max.value;
    const rows: Array<[string[], Field[]]> = [
      [
        ['Zener voltage', 'VZ', izt, x.vzMin!.value, x.vzNom!.value, x.vzMax!.value, 'V'],
        ['vzMin', 'vzNom', 'vzMax', 'izt'],
      ],
      [['Dynamic impedance', 'ZZT', `${izt}, f = 1 kHz`, '', '', x.zzt!.value, x.zzt!.unit], ['zzt']],
      [
        ['Knee impedance', 'ZZK', `IZ = ${x.izk!.value} mA, f = 1 kHz`, '', '', x.zzk!.value, x.zzk!.unit],
        ['zzk', 'izk'],
      ],
      [
        ['Reverse current', 'IR', `VR = ${x.vr!.value} V`, '', '', x.irMax!.value, x.irMax!.unit],
        ['irMax', 'vr'],
      ],
      [['Temperature coefficient', 'SZ', izt, tcMin, x.tc!.value, tcMax, x.tc!.unit], ['tc']],
      [['Forward voltage', 'VF', 'IF = 10 mA', '', '', '0.9', 'V'], []],
      [['Maximum Zener current', 'IZM', 'Tamb = 25 °C', '', '', x.izm!.value, 'mA'], ['izm']],
    ];
    for (const [cells, fields] of rows) {
      sheet.tableRow(PAGE.left, cy, columns, cells, { size: 8 });
      for (const f of fields) rec.value(i, f, sheet.page);
      cy += 14;
    }
    sheet.rule(PAGE.left, PAGE.left + 465, cy - 2, 0.5);
    cy = notes(
      sheet,
      cy + 6,
      [
        `Typical capacitance at VR = 0 V and f = 1 MHz: ${Math.round(400 / v.vz)} pF.`,
        'SZ is measured between 25 °C and 100 °C; the minimum and maximum cover the production spread.',
      ],
      8,
    );
    sheet.text(`Marking code: ${v.marking}`, PAGE.left, cy + 4, { size: 8 });
  });
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('one page per part, min/typ/max table with a conditions column', title, sheet.page) };
}

export async function quarryhill(d: SeriesData): Promise<Built> {
  const title = 'QHZ series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'QS-551', revision: 'A' });
  const rec = new AnswerRecorder(d);
  let y = cover(sheet, {
    title,
    subtitle: '500 mW regulator diodes in SOD-123 and SOD-123F',
    description:
      'General-purpose regulator diodes. Types ending in F use the flat-lead SOD-123F body; electrical values are the same. ' +
      'Leakage is specified at 1 V for all types.',
    features: ['500 mW in both packages', 'VZ 4.7 V to 24 V', 'Flat-lead option for low-profile boards'],
  });
  y = infoLines(sheet, y, 'Ratings', [
    `Total power dissipation: Ptot = ${d.device.pdMax.value} mW at Tamb = 25 °C, on FR4 with minimum pads.`,
    `Junction temperature: Tj = ${d.device.tjMax.value} °C maximum; storage −55 °C to +150 °C.`,
    `Thermal resistance junction to ambient: RthJA = ${d.device.rthJA.value} K/W.`,
  ]);
  rec.device('pdMax', sheet.page);
  rec.device('tjMax', sheet.page);
  rec.device('rthJA', sheet.page);
  y = sheet.heading('Electrical characteristics (Tamb = 25 °C)', y + 4);
  y = seriesTable(sheet, rec, {
    columns: [
      { width: 50, align: 'left', cell: (v) => v.mpn },
      { width: 42, align: 'left', cell: (v) => v.package, isPackage: true },
      { width: 36, align: 'right', cell: withUnit('vzMin'), field: 'vzMin' },
      { width: 32, align: 'right', cell: withUnit('vzNom'), field: 'vzNom' },
      { width: 36, align: 'right', cell: withUnit('vzMax'), field: 'vzMax' },
      { width: 32, align: 'right', cell: withUnit('izt'), field: 'izt' },
      { width: 36, align: 'right', cell: withUnit('zzt'), field: 'zzt' },
      { width: 36, align: 'right', cell: withUnit('izk'), field: 'izk' },
      { width: 38, align: 'right', cell: withUnit('zzk'), field: 'zzk' },
      { width: 38, align: 'right', cell: withUnit('irMax'), field: 'irMax' },
      { width: 38, align: 'right', cell: withUnit('vr'), field: 'vr' },
      { width: 56, align: 'right', cell: withUnit('tc'), field: 'tc' },
    ],
    rows: all(d),
    y: y + 2,
    rowHeight: 13,
    repeatHeader: true,
    header: [spans(['Part number', 'Package', 'VZ min', 'VZ nom', 'VZ max', 'IZT', 'ZZT max', 'IZK', 'ZZK max', 'IR max', 'VR', 'TC typ'])],
  });
  notes(sheet, y, [
    'ZZT is measured at IZT and ZZK at IZK with a 1 kHz signal. IR is measured at VR after 1 s.',
    'TC is typical for the range 25 °C to 125 °C.',
  ]);
  sheet.addPage();
  y = dimensionTable(
    sheet,
    PAGE.top,
    'Package outline SOD-123F',
    [
      ['A', '0.90', '1.10'],
      ['b', '0.70', '0.90'],
      ['D', '1.50', '1.70'],
      ['E', '2.55', '2.75'],
      ['HE', '3.50', '3.80'],
    ],
    'The SOD-123 outline is shown in the package handbook; land patterns differ between the two bodies.',
  );
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('series table with units in the cells and a package column; leakage at 1 V only', title, sheet.page) };
}
