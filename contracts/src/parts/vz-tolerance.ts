/**
 * The Zener-voltage tolerance of a card, as a fraction of vzNom (0.05 for ±5 %): one rule for
 * the search filter, the list column and the card the search shows.
 *
 * Datasheets print the window ends rounded: a ±5 % 5.1 V part spans 4.845…5.355 V and is
 * printed 4.85 / 5.36 V, which read back as ±5.1 %. So a tolerance printed with the values
 * ("±5 %") is taken as printed; otherwise each end is moved inward by half a unit of its last
 * printed digit before the wider side is taken (rounding to the nearest, common practice, no
 * source). The digits come from the printed text when the card keeps it ("5.360 V"), else from
 * the value, counting at most three significant digits (a stored 6 may have been "6.00"), so
 * the allowance errs small. Null without both ends.
 */
export interface ToleranceFields {
  vzNom?: { value: number; printed?: string | null } | null;
  vzMin?: { value: number; printed?: string | null } | null;
  vzMax?: { value: number; printed?: string | null } | null;
}

const PRINTED_PERCENT = /±\s*(\d+(?:[.,]\d+)?)\s*%/;

/** Half a unit of the last decimal digit of a value as written in its shortest form (4.85 → 0.005; 5 → 0.5). */
export function halfLastDigit(value: number): number {
  const text = Math.abs(value).toString();
  if (/e/i.test(text)) return 0;
  const dot = text.indexOf('.');
  const decimals = dot < 0 ? 0 : text.length - dot - 1;
  return 0.5 * 10 ** -decimals;
}

const PRINTED_VOLTS = /(\d+)(?:[.,](\d+))?\s*(m|µ|u)?V\b/;

/** Half a unit of the last printed digit of a window end, in volts. */
export function roundingOf(field: { value: number; printed?: string | null }): number {
  const m = field.printed ? PRINTED_VOLTS.exec(field.printed) : null;
  if (m) return 0.5 * 10 ** -(m[2]?.length ?? 0) * (m[3] === 'm' ? 1e-3 : m[3] ? 1e-6 : 1);
  const v = Math.abs(field.value);
  if (v === 0) return 0;
  return Math.min(halfLastDigit(v), 0.5 * 10 ** (Math.floor(Math.log10(v)) - 2));
}

export function vzTolerance(fields: ToleranceFields): number | null {
  const nom = fields.vzNom?.value;
  if (nom === undefined || nom === null || !(nom > 0)) return null;
  for (const f of [fields.vzNom, fields.vzMin, fields.vzMax]) {
    const m = f?.printed ? PRINTED_PERCENT.exec(f.printed) : null;
    if (m) return Number(m[1].replace(',', '.')) / 100;
  }
  const min = fields.vzMin;
  const max = fields.vzMax;
  if (!min || !max) return null;
  // Inward by the rounding, but never past the nominal value.
  const low = Math.min(nom, min.value + roundingOf(min));
  const high = Math.max(nom, max.value - roundingOf(max));
  return Number((Math.max(nom - low, high - nom) / nom).toPrecision(6));
}
