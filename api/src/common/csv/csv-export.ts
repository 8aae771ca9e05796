import { stringify, type Stringifier } from 'csv-stringify';

/** A cell a spreadsheet would read as a formula (OWASP "CSV Injection"): starts with = + - @, tab or CR. */
const FORMULA_START = /^[=+\-@\t\r]/;
/**
 * A plain decimal number written as text ("-0.0018", "+5", "1e-3"), optionally with a unit of
 * letters, µ, Ω, °, % and / ("-1.4 mV/K"): no operator, cell reference or function can hide in it.
 */
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?( ?[A-Za-zµμΩ°%/]+)?$/;

/**
 * Neutralises one text cell the way OWASP advises: a leading apostrophe, which spreadsheets
 * show as text and do not evaluate. Only text is touched: numbers (JSON numbers, and text
 * that is a plain number such as "-0.0018") stay numbers so exported values compute.
 */
export function neutraliseCsvText(value: string): string {
  return FORMULA_START.test(value) && !PLAIN_NUMBER.test(value) ? `'${value}` : value;
}

/** Undoes neutraliseCsvText when one of our exports is imported again (the apostrophe was ours). */
export function restoreCsvText(value: string): string {
  return value.startsWith("'") && FORMULA_START.test(value.slice(1)) ? value.slice(1) : value;
}

/**
 * The one CSV writer every export uses: UTF-8 with a BOM (so spreadsheets pick the encoding),
 * text cells neutralised against formula injection, numbers written as numbers.
 */
export function csvExportStringifier(): Stringifier {
  return stringify({ bom: true, cast: { string: neutraliseCsvText } });
}
