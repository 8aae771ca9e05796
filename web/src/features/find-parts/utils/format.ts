const day = new Intl.DateTimeFormat('en-GB', { year: 'numeric', month: 'short', day: '2-digit' });

/** "05 Nov 2026"; an en dash when absent. */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '–';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : day.format(date);
}

/** A fraction as a signed-free percentage with up to `digits` significant figures: 0.0526 → "5.26 %". */
export function formatPercent(fraction: number | null | undefined, digits = 3): string {
  if (fraction === null || fraction === undefined || Number.isNaN(fraction)) return '–';
  return `${Number((fraction * 100).toPrecision(digits))} %`;
}

/** A temperature coefficient in mV/K as datasheets print it (V/K in): 0.00034 → "0.34 mV/K", with a true minus. */
export function formatTempCo(voltsPerKelvin: number | null | undefined): string {
  if (voltsPerKelvin === null || voltsPerKelvin === undefined || Number.isNaN(voltsPerKelvin)) return '–';
  const mv = voltsPerKelvin * 1000;
  const text = Math.abs(mv) >= 10 ? Math.abs(mv).toFixed(1) : Math.abs(mv).toFixed(2);
  return `${mv < 0 ? '\u2212' : ''}${text} mV/K`;
}
