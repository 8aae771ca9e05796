import { readMeasurementCsv } from './measurement-csv';

// Unit factors: SI prefixes (common practice, no source); 1 mA = 1e-3 A, 1 µA = 1e-6 A.
describe('reading a measurement CSV', () => {
  it('reads samples with units in the headers, a temperature and a lot column', () => {
    const csv = [
      'Sample,Lot,Current (mA),Voltage (V),Temperature (°C)',
      'S1,L2301,1,5.02,25',
      'S1,L2301,5,5.08,25',
      'S2,L2301,0.5,4.99,75',
      'S2,L2301,20,5.2,75',
    ].join('\n');
    const reading = readMeasurementCsv(csv);
    expect(reading.errors).toEqual([]);
    expect(reading.samples).toHaveLength(2);
    expect(reading.samples[0]).toEqual({
      sampleId: 'S1',
      lot: 'L2301',
      points: [
        { current: 0.001, voltage: 5.02, tempC: 25 },
        { current: 0.005, voltage: 5.08, tempC: 25 },
      ],
    });
    expect(reading.samples[1].points[1]).toEqual({ current: 0.02, voltage: 5.2, tempC: 75 });
  });

  it('takes units from the cells, µA and mV, and negative reverse pairs as magnitudes', () => {
    const reading = readMeasurementCsv('dut;I;V\nA;-250 µA;-4990 mV\nA;-1 mA;-5.01 V'.replace(/;/g, ','));
    expect(reading.errors).toEqual([]);
    expect(reading.samples[0].points[0].current).toBeCloseTo(250e-6, 15);
    expect(reading.samples[0].points[0].voltage).toBeCloseTo(4.99, 12);
    expect(reading.warnings.join(' ')).toMatch(/negative current and voltage/);
    expect(reading.warnings.join(' ')).toMatch(/25 °C/);
  });

  it('names the row and column of a bad cell and keeps the good rows', () => {
    const reading = readMeasurementCsv('sample,current (mA),voltage (V)\nS1,1,5.0\nS1,abc,5.1\nS1,2 V,5.2\nS1,3,-5.3');
    expect(reading.samples[0].points).toHaveLength(1);
    expect(reading.errors.map((e) => [e.row, e.column])).toEqual([
      [3, 'current (mA)'],
      [4, 'current (mA)'],
      [5, 'current (mA)'],
    ]);
  });

  it('says which column is missing', () => {
    const reading = readMeasurementCsv('sample,current (mA)\nS1,1');
    expect(reading.errors[0].message).toMatch(/no voltage column/);
    expect(reading.samples).toEqual([]);
  });

  it('refuses a volt column given in amperes by its header unit', () => {
    const reading = readMeasurementCsv('current (mA),voltage (mA)\n1,5');
    expect(reading.errors[0].column).toBe('voltage (mA)');
  });
});
