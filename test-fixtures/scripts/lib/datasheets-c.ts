import { AnswerRecorder } from './answers';
import { Built } from './datasheets-a';
import { cover, dimensionTable, infoLines, notes, ratingTable, seriesTable, SeriesColumn, spans, val } from './layout-parts';
import { SeriesData } from './series';
import { PAGE, Sheet, TableColumn } from './sheet';

/**
 * Tevorrow: a ten-page datasheet (the upload benchmark's document) with the series table
 * over three pages and pages of text, figures, outline, soldering and ordering data around
 * it. Ostrander: two tables on one page whose test currents are given in the headers.
 */

const all = (d: SeriesData) => d.variants.map((_, i) => i);

export async function tevorrow(d: SeriesData): Promise<Built> {
  const title = 'TPZ15 series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'TPD-1507', revision: '6' });
  const rec = new AnswerRecorder(d);
  const s = d.def.style;
  // Page 1: cover
  cover(sheet, {
    title,
    subtitle: '1.5 W voltage regulator diodes, SMB',
    description:
      'The TPZ15 series are silicon regulator diodes for rail clamping, gate-drive supplies and reference duties in ' +
      'industrial and telecom equipment. The SMB body spreads heat into the board through its wide tabs, so that 1.5 W ' +
      'can be dissipated with 25 mm² of copper per pad. All types are tested at their own test current, chosen so that ' +
      'the product VZ × IZT is about one quarter of the rating.',
    features: [
      'Zener voltage range 7.5 V to 36 V, tolerance ±5 %',
      '1.5 W power dissipation on 25 mm² copper pads',
      'Surge capability 150 W for 100 µs',
      'Low leakage current above 10 V',
      'Glass-passivated junction, high reliability',
      'Available on 13 in reels, 3000 pieces each',
    ],
    applications: [
      'Gate-drive and auxiliary supply clamps',
      'Over-voltage protection of 12 V and 24 V rails',
      'Reference voltages for linear regulators',
      'Telecom line interfaces',
    ],
  });
  // Page 2: ratings
  sheet.addPage();
  let y = ratingTable(sheet, rec, PAGE.top, 'Absolute maximum ratings (Tamb = 25 °C unless otherwise noted)', [
    { label: 'Power dissipation 1)', symbol: 'PD', condition: 'Tamb = 25 °C', value: d.device.pdMax.value, unit: 'W', field: 'pdMax' },
    { label: 'Non-repetitive peak reverse surge power', symbol: 'PRSM', condition: 'tp = 100 µs', value: '150', unit: 'W' },
    { label: 'Peak forward surge current', symbol: 'IFSM', condition: '8.3 ms half sine', value: '10', unit: 'A' },
    {
      label: 'Operating junction temperature range',
      symbol: 'TJ',
      value: `−55 to +${d.device.tjMax.value}`,
      unit: '°C',
      field: 'tjMax',
      printedAs: { value: `+${d.device.tjMax.value}` },
    },
    { label: 'Storage temperature range', symbol: 'Tstg', value: '−55 to +150', unit: '°C' },
  ]);
  y = ratingTable(sheet, rec, y, 'Thermal characteristics', [
    { label: 'Thermal resistance, junction to ambient 1)', symbol: 'RθJA', value: d.device.rthJA.value, unit: '°C/W', field: 'rthJA' },
    { label: 'Thermal resistance, junction to lead', symbol: 'RθJL', value: '25', unit: '°C/W' },
  ]);
  notes(sheet, y, [
    '1) Mounted on FR4, 1.6 mm, with 25 mm² copper per pad. With minimum pads the rating falls to about 0.9 W.',
    'Derate linearly above 25 °C at 12 mW/°C.',
    'Ratings are limiting values; operation at or near them for long periods reduces reliability.',
  ]);
  // Page 3: description and mechanical data
  sheet.addPage();
  y = sheet.heading('General description', PAGE.top);
  y = sheet.paragraph(
    'A regulator diode conducts in reverse once the voltage reaches its breakdown value. Below about 5 V the ' +
      'breakdown is dominated by tunnelling and the voltage falls as the junction warms; above about 6 V avalanche ' +
      'multiplication dominates and the voltage rises with temperature. All TPZ15 types are avalanche types.',
    PAGE.left,
    y,
    PAGE.right - PAGE.left,
  );
  y = sheet.paragraph(
    'The dynamic impedance falls as the current rises. A circuit that runs the diode at a few milliamperes will see a ' +
      'higher impedance than the value at the test current; see the typical characteristics on page 7.',
    PAGE.left,
    y + 4,
    PAGE.right - PAGE.left,
  );
  y = infoLines(sheet, y + 8, 'Mechanical data', [
    'Case: SMB (DO-214AA), moulded plastic over a glass-passivated junction',
    'Terminals: solder plated, suitable for reflow and wave soldering',
    'Polarity: the band marks the cathode',
    'Weight: 93 mg',
  ]);
  rec.packagePage(all(d), sheet.page);
  // Pages 4 to 6: the series table, header repeated on each page
  sheet.addPage();
  y = sheet.heading('Electrical characteristics (Tamb = 25 °C unless otherwise noted)', PAGE.top);
  const columns: SeriesColumn[] = [
    { width: 50, align: 'left', cell: (v) => v.mpn },
    { width: 28, align: 'center', cell: (v) => v.marking },
    { width: 32, align: 'right', cell: val('vzMin'), field: 'vzMin' },
    { width: 32, align: 'right', cell: val('vzNom'), field: 'vzNom' },
    { width: 32, align: 'right', cell: val('vzMax'), field: 'vzMax' },
    { width: 32, align: 'right', cell: val('izt'), field: 'izt' },
    { width: 38, align: 'right', cell: val('zzt'), field: 'zzt' },
    { width: 28, align: 'right', cell: val('izk'), field: 'izk' },
    { width: 46, align: 'right', cell: val('zzk'), field: 'zzk' },
    { width: 40, align: 'right', cell: val('irMax'), field: 'irMax' },
    { width: 28, align: 'right', cell: val('vr'), field: 'vr' },
    { width: 44, align: 'right', cell: val('tc'), field: 'tc' },
    { width: 30, align: 'right', cell: val('izm'), field: 'izm' },
  ];
  y = seriesTable(sheet, rec, {
    columns,
    rows: all(d),
    y: y + 4,
    rowHeight: 16,
    maxRowsPerPage: 9,
    repeatHeader: true,
    continuedCaption: 'Electrical characteristics (continued)',
    header: [
      spans(['Type', 'Marking', ['Zener voltage VZ', 2, 4], 'Test', 'Dyn. imp.', 'Knee', 'Knee imp.', 'Leakage', 'at', 'Temp. co.', 'Max.']),
      spans(['', '', 'min', 'nom', 'max', 'IZT', 'ZZT max', 'IZK', 'ZZK max', 'IR max', 'VR', 'αVZ typ', 'IZM']),
      spans(['', '', '(V)', '(V)', '(V)', '(mA)', `(${s.ohm})`, '(mA)', `(${s.ohm})`, `(${s.micro}A)`, '(V)', `(${s.tcUnit})`, '(mA)']),
    ],
  });
  y = notes(sheet, y, [
    'VZ measured with a 20 ms pulse at IZT. ZZT and ZZK measured with an AC current of 10 % of the DC current at 1 kHz.',
    'IZM is the maximum steady current at Tamb = 25 °C with 25 mm² copper pads.',
  ]);
  // Page 6: a design example, full of numbers that are not ratings
  sheet.addPage();
  y = sheet.heading('Application example: shunt regulator', PAGE.top);
  y = sheet.paragraph(
    'A 12 V auxiliary rail is taken from a 24 V bus that varies from 20 V to 28 V. The load draws 5 mA to 15 mA. ' +
      'Choosing the 12 V type and keeping at least 5 mA in the diode at the lowest supply and the highest load gives ' +
      'R = (20 V − 12.6 V) / 20 mA = 370 Ω; the nearest E24 value below is 360 Ω.',
    PAGE.left,
    y,
    PAGE.right - PAGE.left,
  );
  y = infoLines(sheet, y + 4, 'Check at the other corner', [
    'Highest supply, lowest load: I = (28 V − 11.4 V) / 360 Ω = 46 mA in the diode, of which 5 mA flows to the load.',
    'Dissipation in the diode: 41 mA × 12.6 V = 0.52 W, well inside 1.5 W at 25 °C.',
    'Resistor dissipation: (28 V − 11.4 V)² / 360 Ω = 0.77 W; use a 1 W part.',
    'Example: TPZ15-12 at IZ = 20 mA dissipates about 0.24 W and rises about 20 K above ambient.',
  ]);
  notes(sheet, y, ['This example is a sketch only: confirm the design by measurement over the full temperature range.'], 8);
  // Page 7: typical characteristics
  sheet.addPage();
  y = sheet.heading('Typical characteristics', PAGE.top);
  const figures = [
    ['Fig. 1  Power derating', 'PD (W) against Tamb (°C): 1.5 W at 25 °C falling linearly to 0 W at 150 °C', ['0', '25', '50', '75', '100', '125', '150']],
    ['Fig. 2  Dynamic impedance against current', 'ZZT (Ω) against IZ (mA) for TPZ15-10, TPZ15-20 and TPZ15-36', ['1', '2', '5', '10', '20', '50', '100']],
    ['Fig. 3  Temperature coefficient against Zener voltage', 'αVZ (mV/°C) against VZ (V), typical, IZ = IZT', ['5', '10', '15', '20', '25', '30', '35']],
  ] as const;
  for (const [caption, axes, ticks] of figures) {
    sheet.box(PAGE.left, y, 300, 150);
    ticks.forEach((t, i) => sheet.text(t, PAGE.left + 10 + i * 45, y + 154, { size: 7 }));
    sheet.text(caption, 370, y + 20, { size: 9, bold: true });
    sheet.paragraph(axes, 370, y + 36, 170, { size: 8 });
    y += 200;
  }
  // Page 8: package outline
  sheet.addPage();
  y = dimensionTable(
    sheet,
    PAGE.top,
    'Package outline SMB (DO-214AA)',
    [
      ['A', '1.95', '2.40'],
      ['b', '1.96', '2.21'],
      ['c', '0.15', '0.31'],
      ['D', '3.30', '3.94'],
      ['E', '4.06', '4.57'],
      ['HE', '5.21', '5.59'],
      ['L', '0.76', '1.52'],
    ],
    'Dimensions in millimetres. Mould flash not included.',
  );
  infoLines(sheet, y + 10, 'Recommended land pattern', [
    'Pad width 2.3 mm, pad length 2.5 mm, gap between pads 3.0 mm.',
    'For the full 1.5 W rating enlarge each pad to 25 mm² of copper.',
  ]);
  // Page 9: soldering
  sheet.addPage();
  y = infoLines(sheet, PAGE.top, 'Soldering', [
    'Reflow profile: preheat 150 °C to 200 °C for 60 s to 120 s; time above 217 °C 60 s to 150 s.',
    'Peak reflow temperature 260 °C for at most 10 s; no more than three reflow cycles.',
    'Wave soldering: 260 °C for at most 5 s.',
    'Hand soldering: 350 °C for at most 3 s per terminal.',
    'Moisture sensitivity level 1: unlimited floor life at 30 °C and 85 % RH.',
  ]);
  infoLines(sheet, y + 10, 'Storage', [
    'Store in the original packing at 5 °C to 35 °C and below 60 % RH.',
    'Solderability is guaranteed for 24 months from the date code.',
  ]);
  // Page 10: ordering information and notices
  sheet.addPage();
  y = sheet.heading('Ordering information', PAGE.top);
  const orderColumns: TableColumn[] = [
    { width: 70, align: 'left' },
    { width: 50, align: 'center' },
    { width: 50, align: 'center' },
    { width: 60, align: 'center' },
    { width: 70, align: 'center' },
    { width: 70, align: 'center' },
  ];
  const orderHeader = [spans(['Part number', 'Package', 'Marking', 'Reel size', 'Tape width', 'Pieces per']), spans(['', '', '', '(in)', '(mm)', 'reel'])];
  y = sheet.tableHeader(PAGE.left, y, orderColumns, orderHeader, { size: 8, bold: true, lineHeight: 11 });
  for (const v of d.variants.slice(0, 8)) {
    sheet.tableRow(PAGE.left, y, orderColumns, [`${v.mpn}-13`, 'SMB', v.marking, '13', '12', '3000'], { size: 8 });
    y += 12;
  }
  y = notes(sheet, y + 4, ['Other types of the series follow the same scheme: type number, then -13 for the 13 in reel.'], 8);
  infoLines(sheet, y + 10, 'Notices', [
    'Tevorrow Power Devices reserves the right to change these specifications without notice.',
    'These products are not designed for use in life-support or safety-critical systems unless agreed in writing.',
    'Values described as typical are not tested and may vary between lots.',
  ]);
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('ten pages: series table over three pages with the header repeated, text pages around it', title, sheet.page) };
}

export async function ostrander(d: SeriesData): Promise<Built> {
  const title = 'ODW series';
  const sheet = new Sheet({ vendor: d.def.vendor, title, docId: 'ODW-DS-3', revision: 'E' });
  const rec = new AnswerRecorder(d);
  let y = cover(sheet, {
    title,
    subtitle: 'Avalanche regulator diodes, 500 mW, DO-35 glass',
    description:
      'Hermetically sealed glass regulator diodes for 10 V to 47 V. All types break down by avalanche and have a positive ' +
      'temperature coefficient. Test currents are given in the table headers.',
    features: ['VZ 10 V to 47 V, ±5 %', 'Ptot 0.5 W', 'Tj up to 175 °C', 'Hermetic DO-35 glass body'],
  });
  y = infoLines(sheet, y, 'Mechanical data', ['Case: DO-35 glass, hermetically sealed', 'Leads: tinned copper-clad steel']);
  rec.packagePage(all(d), sheet.page);
  ratingTable(sheet, rec, y, 'Absolute maximum ratings', [
    { label: 'Power dissipation', symbol: 'Ptot', condition: 'lead length 9.5 mm', value: d.device.pdMax.value, unit: 'W', field: 'pdMax' },
    { label: 'Junction temperature', symbol: 'Tj', value: d.device.tjMax.value, unit: '°C', field: 'tjMax' },
    { label: 'Storage temperature range', symbol: 'Tstg', value: '−65 to +175', unit: '°C' },
    {
      label: 'Thermal resistance junction to ambient',
      symbol: 'RthJA',
      condition: 'lead length 9.5 mm',
      value: d.device.rthJA.value,
      unit: 'K/W',
      field: 'rthJA',
    },
    { label: 'Thermal resistance junction to lead', symbol: 'RthJL', condition: 'at 4 mm from the body', value: '170', unit: 'K/W' },
  ]);
  sheet.addPage();
  y = sheet.heading('Electrical characteristics (Tamb = 25 °C)', PAGE.top);
  const columns: SeriesColumn[] = [
    { width: 46, align: 'left', cell: (v) => v.mpn },
    { width: 36, align: 'center', cell: val('vzMin'), field: 'vzMin' },
    { width: 36, align: 'center', cell: val('vzNom'), field: 'vzNom' },
    { width: 36, align: 'center', cell: val('vzMax'), field: 'vzMax' },
    { width: 46, align: 'center', cell: val('zzt'), field: 'zzt' },
    { width: 84, align: 'center', cell: val('zzk'), field: 'zzk' },
    { width: 40, align: 'center', cell: val('irMax'), field: 'irMax' },
    { width: 34, align: 'center', cell: val('vr'), field: 'vr' },
    { width: 50, align: 'center', cell: val('tc'), field: 'tc' },
  ];
  const header = (izt: string) => [
    spans(['Type', [`VZ at IZT = ${izt} mA`, 1, 3], 'ZZT at IZT', 'ZZK at IZK = 0.25 mA', ['IR at VR', 6, 7], 'TC']),
    spans(['', 'min', 'nom', 'max', 'max', 'max', 'max', '', 'typ']),
    spans(['', '(V)', '(V)', '(V)', '(ohm)', '(ohm)', '(uA)', '(V)', '(mV/°C)']),
  ];
  const low = all(d).filter((i) => d.variants[i].vz <= 24);
  const high = all(d).filter((i) => d.variants[i].vz > 24);
  sheet.text(`Table 1 — types ${d.variants[low[0]].mpn} to ${d.variants[low[low.length - 1]].mpn}`, PAGE.left, y, { size: 9, bold: true });
  y = seriesTable(sheet, rec, { columns, rows: low, y: y + 18, repeatHeader: true, header: header('5'), headerFields: ['izt', 'izk'] });
  sheet.text(`Table 2 — types ${d.variants[high[0]].mpn} to ${d.variants[high[high.length - 1]].mpn}`, PAGE.left, y + 8, { size: 9, bold: true });
  y = seriesTable(sheet, rec, { columns, rows: high, y: y + 26, repeatHeader: true, header: header('2'), headerFields: ['izt', 'izk'] });
  notes(sheet, y, ['VZ is measured 90 s after the test current is applied, with the diode in still air at 25 °C.', 'TC is typical between 25 °C and 100 °C.']);
  sheet.addPage();
  dimensionTable(
    sheet,
    PAGE.top,
    'Package outline DO-35',
    [
      ['A', '3.05', '4.25'],
      ['b', '0.46', '0.56'],
      ['D', '1.53', '2.00'],
      ['L', '25.4', '38.1'],
    ],
    'Cathode marked by a coloured band. Dimensions in millimetres.',
  );
  const pdf = await sheet.finish();
  return { pdf, answers: rec.key('two series tables on one page, test currents given in the column headers, ASCII units', title, sheet.page) };
}
