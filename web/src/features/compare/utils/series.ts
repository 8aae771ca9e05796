import type { ComparePayload } from '@shuntwise/contracts';

/** Mantine colours for the sources, in order: the approved source keeps the first. */
export const SOURCE_COLORS = ['copper.6', 'blue.6', 'verdigris.6', 'grape.6', 'cyan.7', 'pink.6', 'lime.7', 'indigo.5'] as const;

/** Line dashes per ambient: 25 °C solid, colder long dashes, hotter dots. */
export function dashFor(tempC: number): string | undefined {
  if (tempC === 25) return undefined;
  return tempC < 25 ? '8 4' : '2 3';
}

export type Corner = 'vzMin' | 'vzNom' | 'vzMax';

export function seriesKey(sourceIndex: number, tempIndex: number, corner: Corner): string {
  return `s${sourceIndex}t${tempIndex}${corner}`;
}

/** The key of a source's tolerance band at one ambient: [low end, high end] (V) per current. */
export function bandKey(sourceIndex: number, tempIndex: number): string {
  return `s${sourceIndex}t${tempIndex}band`;
}

export type CurveRow = Record<string, number | null | [number, number]>;

/**
 * One row per current of the grid with every source's voltage at every ambient and
 * tolerance end, and each tolerance band as a [low, high] pair (what a recharts range
 * area reads); all curves share the grid. A band is null where either end is unknown.
 */
export function curveRows(payload: ComparePayload): CurveRow[] {
  return payload.currents.map((current, i) => {
    const row: CurveRow = { current };
    payload.sources.forEach((source, s) => {
      source.curves.forEach((curve, t) => {
        const point = curve.points[i];
        for (const corner of ['vzMin', 'vzNom', 'vzMax'] as const) row[seriesKey(s, t, corner)] = point ? point[corner] : null;
        row[bandKey(s, t)] = point && point.vzMin !== null && point.vzMax !== null ? [point.vzMin, point.vzMax] : null;
      });
    });
    return row;
  });
}

// Axis helpers are shared with the measured-samples chart.
export { logTicks, niceTicks, shortQuantity } from '@/lib/chart-axes';
