import type { QuantityKind } from '@shuntwise/contracts';
import { LABELS } from './field-patterns';
import { findPackage } from './part-numbers';
import { findQuantities, toSi } from './quantity-text';
import { Line, lineBox } from './text-layout';
import { Candidate, PackageCandidate } from './variant-drafts';

/**
 * Values printed once for the whole series: power rating, junction temperature, thermal
 * resistance to ambient, package. Found by label or symbol ("Ptot", "Tj", "RthJA", "Case:");
 * a line with the symbol (a ratings table) beats prose that merely mentions the words.
 */

export interface DeviceValues {
  pdMax?: Candidate;
  tjMax?: Candidate;
  rthJA?: Candidate;
  package?: PackageCandidate;
}

interface Rule {
  symbol: RegExp;
  words: RegExp;
  exclude: RegExp;
  kind: QuantityKind;
  /** Ranges such as "−55 to +150 °C" give their upper end. */
  upperOfRange?: boolean;
}

const RULES: Record<'pdMax' | 'tjMax' | 'rthJA', Rule> = {
  pdMax: {
    symbol: /\bP\s?(?:tot|D)\b/,
    words: /\bpower\s+(?:dissipation|rating)\b/i,
    exclude: /surge|peak|pulse|non-repetitive|derat|\bP\s?[ZR]SM\b/i,
    kind: 'power',
  },
  tjMax: {
    symbol: /\bT\s?[jJ]\b/,
    words: /\bjunction\s+temp/i,
    exclude: /^(?!.*junction).*(?:storage|solder|reflow|lead\s+temp|wave)|solder|reflow/i,
    kind: 'temperature',
    upperOfRange: true,
  },
  rthJA: {
    symbol: /\bR\s?(?:th|θ)\s?\(?j-?a\)?/i,
    words: /\bjunction\s+to\s+ambient/i,
    exclude: LABELS.notRthJA,
    kind: 'thermalResistance',
  },
};

function readRule(line: Line, rule: Rule): { candidate: Candidate; score: number } | undefined {
  const text = line.text;
  if (rule.exclude.test(text)) return undefined;
  const symbol = rule.symbol.exec(text);
  const words = rule.words.exec(text);
  if (!symbol && !words) return undefined;
  const start = Math.min(symbol?.index ?? Infinity, words?.index ?? Infinity);
  const tokens = findQuantities(text).filter((t) => t.index > start);
  const at = tokens.findIndex((t) => t.kind === rule.kind);
  if (at < 0) return undefined;
  let token = tokens[at];
  if (rule.upperOfRange) {
    // "−55 to +150 °C": the unitless numbers just before the unit belong to the range.
    let k = at - 1;
    while (k >= 0 && !tokens[k].unit && text.slice(tokens[k].end, tokens[k + 1].index).match(/^\s*(?:to|…|\.\.\.|–|-|\s)\s*$/)) {
      if (Number(tokens[k].value.replace('−', '-')) > Number(token.value.replace('−', '-'))) token = { ...tokens[k], unit: token.unit, kind: token.kind };
      k--;
    }
  }
  const si = toSi(token.value, token.unit, rule.kind);
  if (si === undefined) return undefined;
  const score = (symbol ? 2 : 0) + (words ? 1 : 0);
  return { candidate: { value: token.value, unit: token.unit, kind: rule.kind, si, page: line.page, text, box: lineBox(line), rank: 0 }, score };
}

export function readDeviceValues(pages: Line[][], used: Set<Line>): DeviceValues {
  const best: Record<string, { candidate: Candidate; score: number } | undefined> = {};
  let pkg: { candidate: PackageCandidate; score: number } | undefined;
  for (const lines of pages) {
    for (const line of lines) {
      if (used.has(line)) continue;
      for (const [field, rule] of Object.entries(RULES)) {
        const found = readRule(line, rule);
        if (found && (!best[field] || found.score > best[field]!.score)) best[field] = found;
      }
      const p = findPackage(line.text);
      if (p) {
        const score = /^(?:case|package)\b/i.test(line.text) ? 2 : /\b(?:package|case|outline)\b/i.test(line.text) ? 1 : 0;
        if (!pkg || score > pkg.score) pkg = { candidate: { value: p.value, page: line.page, text: line.text, box: lineBox(line), rank: 0 }, score };
      }
    }
  }
  return { pdMax: best.pdMax?.candidate, tjMax: best.tjMax?.candidate, rthJA: best.rthJA?.candidate, package: pkg?.candidate };
}
