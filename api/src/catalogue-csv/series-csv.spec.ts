import { parseSeriesCsv, readHeader, SeriesCsvError } from './series-csv';

// Expected SI values follow from the SI prefixes (BIPM SI Brochure, 9th edition): m = 10⁻³,
// µ = 10⁻⁶; a kelvin step equals a degree-Celsius step. A coefficient in %/K is relative to
// Vz (definition; common practice, no source).
describe('readHeader', () => {
  it.each([
    ['izt (mA)', 'izt', 'mA'],
    ['izt [mA]', 'izt', 'mA'],
    ['  zzt ( Ω ) ', 'zzt', 'Ω'],
    ['mpn', 'mpn', null],
    ['Vz nom', 'Vz nom', null],
  ])('%s', (header, name, unit) => {
    expect(readHeader(header)).toEqual({ name, unit });
  });
});

describe('parseSeriesCsv', () => {
  it('reads units from the header, from the cell, or both spellings of µ and Ω', () => {
    const csv = ['mpn,vz nom (V),IZT,zzt (ohm),irMax,tc', 'A-1,5.1,5 mA,40,0.5 uA,-2.5 mV/°C', 'A-2,5.6,5mA,30,0.5 μA,0.05 %/K'].join('\n');
    const { rows, warnings } = parseSeriesCsv(csv, { manufacturer: 'Invented Maker' });
    expect(warnings).toEqual([]);
    expect(rows.map((r) => r.errors)).toEqual([[], []]);
    const [a, b] = rows.map((r) => r.fields!);
    expect(a.vzNom.value).toBe(5.1);
    expect(a.izt.value).toBeCloseTo(5e-3, 15);
    expect(a.zzt!.value).toBe(40);
    expect(a.irMax!.value).toBeCloseTo(5e-7, 18);
    expect(b.irMax!.value).toBeCloseTo(5e-7, 18);
    expect(a.tc).toMatchObject({ value: -2.5, unit: 'mV/K' });
    expect(b.tc).toMatchObject({ value: 0.05, unit: '%/K' });
    expect(a.izt.provenance).toEqual({ source: 'imported', datasheetId: null, page: null, text: '5 mA' });
    expect(a.zzt!.printed).toBe('40 ohm');
  });

  it('records the datasheet and page for every value when the import names a datasheet', () => {
    const { rows } = parseSeriesCsv('mpn,page,vzNom (V),izt (mA)\nB-1,2,3.3,5', { manufacturer: 'M', datasheetId: 7 });
    expect(rows[0].fields!.vzNom.provenance).toEqual({ source: 'imported', datasheetId: 7, page: 2, text: '3.3 V' });
  });

  it('takes a BOM, semicolons, CRLF and blank lines', () => {
    const { rows } = parseSeriesCsv('\uFEFFmanufacturer;mpn;vzNom;izt\r\n\r\nM;C-1;12 V;10 mA\r\n', {});
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ row: 3, manufacturer: 'M', mpn: 'C-1', errors: [] });
  });

  it('names the row and column of every problem and never guesses a unit', () => {
    const csv = [
      'mpn,vzNom,izt,zzt,lifecycleNote',
      'D-1,5.1,5,40 ohm,',
      'D-2,5.1 V,5 mA,40 V,',
      `D-3,5.1 V,5 mA,,${'x'.repeat(501)}`,
      'D-4,5.1 V,5 mA,,,extra',
    ].join('\n');
    const { rows } = parseSeriesCsv(csv, { manufacturer: 'M' });
    expect(rows.flatMap((r) => r.errors.map((e) => `${e.row}:${e.column}`))).toEqual(['2:vzNom', '2:izt', '3:zzt', '4:lifecycleNote', '5:(row)']);
    expect(rows[0].errors[0].message).toBe('cannot read "5.1" as a voltage (e.g. 5.1 V, 500 mV) (no unit given)');
    expect(rows[1].errors[0].message).toMatch(/cannot read "40 V" as a resistance/);
    expect(rows.every((r) => r.fields === null)).toBe(true);
  });

  it("applies the engineering core's contradictions to each row", () => {
    const { rows } = parseSeriesCsv('mpn,vzMin (V),vzNom (V),izt (mA),izk (mA)\nE-1,5.4,5.1,5,10', { manufacturer: 'M' });
    expect(rows[0].errors.map((e) => e.column)).toEqual(['vzMin (V)', 'izk (mA)']);
  });

  it('refuses files it cannot read as a series', () => {
    expect(() => parseSeriesCsv('', {})).toThrow(SeriesCsvError);
    expect(() => parseSeriesCsv('vzNom\n5.1 V', { manufacturer: 'M' })).toThrow(/mpn column/);
    expect(() => parseSeriesCsv('mpn,vzNom (mA)\nX,5', { manufacturer: 'M' })).toThrow(/unit "mA" does not fit vzNom/);
    expect(() => parseSeriesCsv('mpn,"vzNom\nX', { manufacturer: 'M' })).toThrow(/cannot be read near line/);
  });

  it('reads the headers in words the card export writes exactly as the short names', () => {
    const words =
      'Manufacturer part number,Zener voltage nominal (V),Test current (mA),Dynamic impedance at test current (ohm),Temperature coefficient,Temperature coefficient converted (V/K),Unconfirmed fields\nW-1,5.1,5,40,-1.4 mV/K,-0.0014,Test current';
    const short = 'mpn,vzNom (V),izt (mA),zzt (ohm),tc,tcVoltsPerKelvin (V/K),unconfirmedFields\nW-1,5.1,5,40,-1.4 mV/K,-0.0014,izt';
    const a = parseSeriesCsv(words, { manufacturer: 'M' });
    const b = parseSeriesCsv(short, { manufacturer: 'M' });
    expect(a.warnings).toEqual([]);
    expect(a.columns.map((c) => c.field)).toEqual(['mpn', 'vzNom', 'izt', 'zzt', 'tc', null, null]);
    expect(a.rows[0].errors).toEqual([]);
    expect(a.rows[0].values).toEqual(b.rows[0].values);
  });

  it('reads our own export columns quietly and warns about others', () => {
    const { warnings } = parseSeriesCsv('mpn,cardVersion,tcVoltsPerKelvin (V/K),colour\nX,1,0.001,red', { manufacturer: 'M' });
    expect(warnings).toEqual(['column "colour" is not a card field or part column and is not read']);
  });
});
