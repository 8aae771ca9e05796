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

/**
 * One row per current of the grid with every source's voltage at every ambient and
 * tolerance end, the shape a recharts line chart reads (all curves share the grid).
 */
export function curveRows(payload: ComparePayload): Array<Record<string, number | null>> {
  return payload.currents.map((current, i) => {
    const row: Record<string, number | null> = { current };
    payload.sources.forEach((source, s) => {
      source.curves.forEach((curve, t) => {
        const point = curve.points[i];
        for (const corner of ['vzMin', 'vzNom', 'vzMax'] as const) row[seriesKey(s, t, corner)] = point ? point[corner] : null;
      });
    });
    return row;
  });
}

// Axis helpers are shared with the measured-samples chart.
export { logTicks, niceTicks, shortQuantity } from '@/lib/chart-axes';
