import { Readable } from 'node:stream';
import { csvExportStringifier, neutraliseCsvText, restoreCsvText } from './csv-export';

async function write(rows: unknown[][]): Promise<string> {
  let out = '';
  for await (const chunk of Readable.from(rows).pipe(csvExportStringifier())) out += String(chunk);
  return out.replace(/^\uFEFF/, '');
}

// The characters and the apostrophe remedy are OWASP's "CSV Injection" guidance (common practice).
describe('CSV export neutralises formula cells', () => {
  it.each(['=1+1', '+cmd', '-2+3', '@SUM(A1)', '\tx', '\rx', '=HYPERLINK("http://x.invalid")'])('prefixes text %j with an apostrophe', (cell) => {
    expect(neutraliseCsvText(cell)).toBe(`'${cell}`);
  });

  it('reads a neutralised cell back as written', () => {
    for (const cell of ['=1+1', '-cmd', '@x', 'plain', "'quoted"]) expect(restoreCsvText(neutraliseCsvText(cell))).toBe(cell);
  });

  it('leaves other text alone', () => {
    expect(neutraliseCsvText('DZ-5V1')).toBe('DZ-5V1');
    expect(neutraliseCsvText('')).toBe('');
    expect(neutraliseCsvText('a=b')).toBe('a=b');
  });

  it('keeps numbers numbers: a negative coefficient stays -0.0018, as a number or as plain-number text', async () => {
    expect(neutraliseCsvText('-0.0018')).toBe('-0.0018');
    expect(neutraliseCsvText('+5')).toBe('+5');
    expect(neutraliseCsvText('-1e-3')).toBe('-1e-3');
    expect(neutraliseCsvText('-1.4 mV/K')).toBe('-1.4 mV/K');
    expect(neutraliseCsvText('-1+A1')).toBe("'-1+A1");
    expect(neutraliseCsvText("-2 cmd|' /C calc'!A0")).toBe("'-2 cmd|' /C calc'!A0");
    const csv = await write([
      ['tc', 'note'],
      [-0.0018, '=1+2'],
      ['-0.0018', '-cmd|x'],
    ]);
    expect(csv.split(/\r?\n/).filter(Boolean)).toEqual(['tc,note', "-0.0018,'=1+2", "-0.0018,'-cmd|x"]);
  });
});
