import { describe, expect, it } from 'vitest';
import { findTextRuns, unionRect, type TextRun } from './find-text';

// A page as pdf.js's text layer lays it out: runs of text with their rectangles (px).
const run = (text: string, left: number, top: number, width = text.length * 6): TextRun => ({ text, left, top, width, height: 10 });
const page: TextRun[] = [
  run('Zener voltage, nominal', 40, 100),
  run('VZnom', 200, 100),
  run('5.1 V', 300, 100),
  run('at IZT', 360, 100),
  run('Temperature coefficient', 40, 120),
  run('αVZ', 200, 120),
  run('−0.8 mV/°C', 300, 121),
  run('PWZ-5V1', 40, 300),
  run('4.85', 120, 300),
  run('5.1', 160, 300),
];

describe('findTextRuns', () => {
  it('finds the printed line of a value, not the other lines that share a figure', () => {
    const found = findTextRuns(page, 'Zener voltage, nominal VZnom 5.1 V at IZT');
    expect(found?.map((r) => r.text)).toEqual(['Zener voltage, nominal', 'VZnom', '5.1 V', 'at IZT']);
    expect(unionRect(found!)).toEqual({ left: 40, top: 100, width: 360 + 6 * 6 - 40, height: 10 });
  });

  it('reads a true minus sign as the hyphen the extraction may have written', () => {
    const found = findTextRuns(page, 'Temperature coefficient αVZ -0.8 mV/°C');
    expect(found?.map((r) => r.text)).toContain('−0.8 mV/°C');
  });

  it('says nothing when no line shares enough of the text', () => {
    expect(findTextRuns(page, 'Junction temperature 175 °C')).toBeNull();
    expect(findTextRuns(page, '')).toBeNull();
  });
});
