/** Telling part numbers and package names apart from the other tokens of a datasheet. */

/** Package outlines as the trade names them, longest spelling first. */
const PACKAGES = [
  'SOD-123FL',
  'SOD-123F',
  'SOD-123',
  'SOD-323F',
  'SOD-323',
  'SOD-523',
  'SOD-923',
  'SOD-80',
  'SOT-23',
  'SOT-323',
  'SOT-523',
  'DO-214AA',
  'DO-214AB',
  'DO-214AC',
  'DO-213AA',
  'DO-213AB',
  'DO-201AD',
  'DO-15',
  'DO-35',
  'DO-41',
  'MicroMELF',
  'MiniMELF',
  'MELF',
  'SMAF',
  'SMA',
  'SMB',
  'SMC',
];

const PACKAGE_RE = new RegExp(`(?<![A-Za-z0-9-])(${PACKAGES.map((p) => p.replace(/-/g, '[-\\s]?')).join('|')})(?![A-Za-z0-9])`, 'i');

/** The first package name in a text, spelled as the list spells it. */
export function findPackage(text: string): { value: string; index: number } | undefined {
  const m = PACKAGE_RE.exec(text);
  if (!m) return undefined;
  const flat = m[1].replace(/[-\s]/g, '').toUpperCase();
  const value = PACKAGES.find((p) => p.replace(/-/g, '').toUpperCase() === flat) ?? m[1];
  return { value, index: m.index };
}

/**
 * A manufacturer part number as series tables and headings print them: starts with a
 * letter, 4–24 characters of letters, digits and - . / +, at least two letters and a digit;
 * not a package name and not a quantity.
 */
export function isPartNumber(text: string): boolean {
  const t = text.trim();
  if (t.length < 4 || t.length > 24) return false;
  if (!/^[A-Za-z][A-Za-z0-9.\-/+]*$/.test(t)) return false;
  if (!/\d/.test(t) || (t.match(/[A-Za-z]/g) ?? []).length < 2) return false;
  if (findPackage(t)?.index === 0 && findPackage(t)!.value.length >= t.replace(/\s/g, '').length - 1) return false;
  return true;
}

/** "Type AM-ZR5V1", "Part number: NMZ-05V1" or the part number alone. */
export function headingPartNumber(text: string): string | undefined {
  const m = /^(?:(?:type|part(?:\s+number)?|device|ordering\s+code)\s*:?\s*)?(\S+)$/i.exec(text.trim());
  return m && isPartNumber(m[1]) ? m[1] : undefined;
}

/** The letters a part number starts with ("GPWN" of "GPWN-22", "QHZ" of "QHZ5V1A"): parts of one series share them. */
export function seriesLetters(mpn: string): string {
  return /^\p{L}+/u.exec(mpn)?.[0].toUpperCase() ?? '';
}
