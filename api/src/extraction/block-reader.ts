import type { ExtractionField } from '@shuntwise/contracts';
import { fieldFor, findConditions, Qualifier } from './field-patterns';
import { flat } from './device-values';
import { findPackage, headingPartNumber, isPartNumber } from './part-numbers';
import { findQuantities, headerUnit, isNumericCell, isUnitOnly, QuantityToken, toSi, unitKind } from './quantity-text';
import { Cell, cellBox, Line, wordSpaced } from './text-layout';
import { FIELD_KINDS, orderOf, VariantDraft, VariantDrafts } from './variant-drafts';
import { CONDITION_SYMBOL, TOLERANCE_LEGEND_CONTEXT } from './vocabulary';

/**
 * Per-part blocks: a heading with the part number, then one line per characteristic —
 * "Zener voltage, nominal  VZnom  5.1 V", "Reverse current  IR  ≤ 10 µA  at VR = 1 V", or a
 * Parameter / Symbol / Conditions / Min / Typ / Max / Unit table. A block runs to the next
 * heading or the end of the page.
 */

const SECTION_TITLE =
  /^(?:absolute\s+)?maximum\s+ratings|^ordering|^package\s+(?:outline|dimensions)|^design\s+example|^typical\s+characteristics|^features\b|^applications?\b|^notes?\b/i;

const LEADER = /(?:\.\s?){4,}|…{2,}/;

interface QualifierColumn {
  qualifier: Qualifier;
  x0: number;
  x1: number;
}

function headingOf(line: Line): string | undefined {
  // "XY5V1 (IT = 5 mA, IZ(K) = 0.5 mA)": a heading with the part's test conditions in brackets,
  // in one cell or several (a scan reads wider gaps between its words).
  const bracketed = /^(\S+)\s*\(([^()]*(?:\([^()]*\)[^()]*)*)\)$/;
  const withConditions = bracketed.exec(line.cells[0].text) ?? bracketed.exec(line.text);
  if (withConditions && isPartNumber(withConditions[1]) && findConditions(withConditions[2]).conditions.length > 0) return withConditions[1];
  if (line.cells.length > 3) return undefined;
  const mpn = headingPartNumber(line.cells[0].text);
  if (!mpn) return undefined;
  return line.cells.slice(1).some((c) => isNumericCell(c.text)) ? undefined : mpn;
}

/** A "Min Typ Max" header line: where each qualifier's column is. */
function qualifierColumns(line: Line): QualifierColumn[] | undefined {
  const cols: QualifierColumn[] = [];
  for (const c of line.cells) {
    const m = /^(min|nom|typ|max)(?:imum|inal|ical)?\.?$/i.exec(c.text);
    if (m) cols.push({ qualifier: m[1].toLowerCase() as Qualifier, x0: c.x0, x1: c.x1 });
  }
  return cols.length >= 2 ? cols : undefined;
}

function qualifierAt(cols: QualifierColumn[], cell: Cell): Qualifier | undefined {
  const c = (cell.x0 + cell.x1) / 2;
  let best: QualifierColumn | undefined;
  let bestDistance = Infinity;
  for (const q of cols) {
    const d = Math.abs((q.x0 + q.x1) / 2 - c);
    if (d < bestDistance) {
      best = q;
      bestDistance = d;
    }
  }
  // Columns are about 40 pt apart; a value far from every qualifier column is something else.
  return best && bestDistance < 25 ? best.qualifier : undefined;
}

interface ValueToken {
  token: QuantityToken;
  cell: Cell;
}

export function readBlocks(pages: Line[][], used: Set<Line>, drafts: VariantDrafts): void {
  const vz = new VzLines();
  for (const lines of pages) {
    let mpn: string | undefined;
    let order = 0;
    let qualifiers: QualifierColumn[] | undefined;
    let skip: Line | undefined;
    // What the current block has printed once: a part's block names its package and each of its
    // Zener-voltage lines once, so a second one means the block has run into the next part's,
    // whose heading was lost (as a scan can lose it): the block ends there rather than give this
    // part the next one's figures.
    const seen = new Set<string>();
    const endBlock = () => {
      vz.endBlock();
      seen.clear();
      mpn = undefined;
    };
    for (const [k, original] of lines.entries()) {
      if (used.has(original) || original === skip) continue;
      let line = original;
      // "XY5V1 (TA = 25 °C, IT = 1 mA, IZK = 0.5 / mA, VR = 8.4 V)": a heading whose conditions wrap onto the next line.
      const next = lines[k + 1];
      // Brackets inside the conditions ("IZ(K) = 0.5") stay balanced on either line.
      const opened = /^\S+\s*\((?:[^()]|\([^()]*\))*$/;
      const closes = /^(?:[^()]|\([^()]*\))*\)$/;
      if (line.cells.length === 1 && opened.test(line.text) && next && next.cells.length === 1 && closes.test(next.text)) {
        const text = `${line.text} ${next.text}`;
        const joined: Line = {
          ...line,
          text,
          printed: `${line.printed} ${next.printed}`,
          cells: [{ ...line.cells[0], text, printed: `${line.cells[0].printed} ${next.cells[0].printed}` }],
        };
        if (headingOf(joined)) {
          line = joined;
          skip = next;
        }
      }
      const heading = headingOf(line);
      if (heading) {
        endBlock();
        mpn = heading;
        order = orderOf(line.page, line.index);
        qualifiers = undefined;
        for (const cond of findConditions(line.text).conditions) {
          const si = toSi(cond.value, cond.unit, cond.kind);
          if (si !== undefined) {
            drafts.get(heading, order).offer(cond.field, {
              value: cond.value,
              unit: cond.unit,
              kind: cond.kind,
              si,
              page: line.page,
              text: line.printed,
              box: cellBox(line.cells[0]),
              rank: 1,
              method: 'list',
            });
          }
        }
        continue;
      }
      // A section title ("Maximum ratings, DS series", "Ordering information") ends the part's block.
      if (SECTION_TITLE.test(line.text) && (line.cells.length <= 2 || wordSpaced(line)) && !findQuantities(line.text).some((t) => t.unit)) {
        endBlock();
        continue;
      }
      if (!mpn) continue;
      // "Package: SOD-523" (or a leader line to it) inside a part's block is that part's package.
      const pkg = /^(?:package|case)\b/i.test(line.text) ? findPackage(line.text) : undefined;
      if (pkg && seen.has('package')) {
        endBlock();
        continue;
      }
      if (pkg) seen.add('package');
      if (pkg && line.cells.length <= 2) {
        drafts
          .get(mpn, order)
          .offerPackage({ value: pkg.value, page: line.page, text: line.printed, box: cellBox(line.cells[line.cells.length - 1]), rank: 2 });
        continue;
      }
      const q = qualifierColumns(line);
      if (q) {
        qualifiers = q;
        continue;
      }
      // A line of prose (a legend, a note, an example) is not a key–value line: "the 4.3 V type" is no rating of this part.
      // A dot leader ("Knee impedance, rzk (Ω) ....... 73 @ 1 mA") makes it a key–value line however long.
      if (line.cells.length === 1 && line.text.split(/\s+/).length >= 9 && !LEADER.test(line.text)) continue;
      // The same when a lost word split such a line into cells: a tolerance legend (read by
      // tolerance-suffix.ts) or a line naming another part ("Example: NS220A is the 22 V type").
      if (TOLERANCE_LEGEND_CONTEXT.test(line.text) || namesAnotherPart(line.text, mpn)) continue;
      const current = mpn;
      if (readLine(line, qualifiers, () => drafts.get(current, order), vz, seen) === 'repeated') endBlock();
    }
    endBlock();
  }
  vz.settle();
}

type Offer = Parameters<VariantDraft['offer']>[1];

/**
 * The Zener-voltage lines of the document's part blocks. A line that names no qualifier
 * ("Zener voltage, UZ ..... 46.1 V") is the nominal where the document's blocks print VZ that
 * way. Where other VZ lines of the document carry "min", "typ" or "max", the layout qualifies
 * its VZ lines, and an unqualified one is most likely a line whose qualifier was lost (a scan
 * dropped "min."): it stands as the nominal only where its own block also has a qualified
 * minimum and maximum and it lies between them. Otherwise it is left out rather than returned
 * as a wrong nominal.
 */
class VzLines {
  private block = new Map<'vzMin' | 'vzNom' | 'vzMax', number>();
  private qualifiedAnywhere = false;
  private readonly held: Array<{ draft: () => VariantDraft; offer: Offer; between: () => boolean }> = [];

  qualifiedLine(field: 'vzMin' | 'vzNom' | 'vzMax', si: number): void {
    this.qualifiedAnywhere = true;
    if (!this.block.has(field)) this.block.set(field, si);
  }

  unqualifiedLine(draft: () => VariantDraft, offer: Offer): void {
    const block = this.block;
    const between = () => {
      const [min, max] = [block.get('vzMin'), block.get('vzMax')];
      return min !== undefined && max !== undefined && offer.si > min && offer.si < max;
    };
    this.held.push({ draft, offer, between });
  }

  endBlock(): void {
    this.block = new Map();
  }

  /** Offers the unqualified lines that stand, once every block of the document has been read. */
  settle(): void {
    for (const { draft, offer, between } of this.held.splice(0)) {
      if (!this.qualifiedAnywhere || between()) draft().offer('vzNom', offer);
    }
  }
}

/** Whether the text names a part number that is neither this part nor one of its ordering codes or suffixed types. */
export function namesAnotherPart(text: string, mpn: string): boolean {
  const own = flat(mpn);
  return text.split(/\s+/).some((word) => {
    const w = word.replace(/^[("“]+|[),:;.”"]+$/g, '');
    if (!isPartNumber(w)) return false;
    const other = flat(w);
    return !other.startsWith(own) && !own.startsWith(other);
  });
}

/**
 * The label without the test conditions that lost their figure ("IZ = mA", "VRM = V": a scan
 * dropped the number). Complete conditions were cut before; what is left of one would name the
 * row's field by its symbol (IZ → a test current) and lend the row its unit (mA), and a Zener
 * voltage or coefficient row became a test current of the row's figures.
 */
export function withoutLostConditions(label: string): string {
  // The symbol with its sign, and the word after it when that is the lost figure's unit.
  const lost = new RegExp(`${CONDITION_SYMBOL.source}(\\S+)?`, CONDITION_SYMBOL.flags);
  return label
    .replace(lost, (_m, _symbol: string, next?: string) => (next && !isUnitOnly(next) ? ` ${next}` : ' '))
    .replace(/\s+/g, ' ')
    .trim();
}

/** Reads one key–value line into the part's draft; 'repeated' (and nothing read) when it is a second line of the block for a Zener voltage already read. */
function readLine(line: Line, qualifiers: QualifierColumn[] | undefined, draft: () => VariantDraft, vz: VzLines, seen: Set<string>): 'repeated' | void {
  const cleaned = line.cells.map((cell) => ({ cell, rest: findConditions(cell.text).rest }));
  const labelParts: string[] = [];
  const values: ValueToken[] = [];
  let unitCell: string | undefined;
  for (const { cell, rest } of cleaned) {
    const tokens = findQuantities(rest);
    if (values.length === 0 && tokens.length === 0) {
      labelParts.push(rest);
      continue;
    }
    if (values.length === 0 && tokens.length && tokens[0].index > 0) labelParts.push(rest.slice(0, tokens[0].index));
    if (tokens.length === 0 && isUnitOnly(rest)) unitCell = rest.trim();
    // A figure with a closing bracket after it and no opening one before ("+14.52) mV/°C"): a
    // footnote mark "(2)" whose opening bracket a scan lost, its digit run into the figure.
    for (const t of tokens) if (!(/^\)/.test(rest.slice(t.end)) && !rest.slice(0, t.index).includes('('))) values.push({ token: t, cell });
  }
  if (values.length === 0) return;
  const label = withoutLostConditions(labelParts.join(' '));
  // "Regulation voltage, UZ (V) ...... 7.50": the unit stands in the key, in brackets.
  unitCell ??= headerUnit(label);
  const unitFor = (v: ValueToken) => v.token.unit || unitCell || '';
  const kind = (() => {
    for (const v of values) {
      const u = unitFor(v);
      const k = u ? unitKind(u) : undefined;
      if (k) return k;
    }
    return undefined;
  })();
  const match = fieldFor(label, kind);
  if (!match) return;
  if (!qualifiers && (match.field === 'vzMin' || match.field === 'vzNom' || match.field === 'vzMax')) {
    const key = `${match.field} ${match.qualifier ?? ''}`;
    if (seen.has(key)) return 'repeated';
    seen.add(key);
  }
  const method = qualifiers ? 'table' : 'list';

  const chosen: Array<[ExtractionField, ValueToken]> = [];
  let unqualifiedVz = false;
  const byQualifier = (wanted: Qualifier[]) => {
    if (!qualifiers) return undefined;
    for (const w of wanted) {
      const v = values.find((x) => qualifierAt(qualifiers, x.cell) === w);
      if (v) return v;
    }
    return undefined;
  };
  const f = match.field;
  if (f === 'vzMin' || f === 'vzNom' || f === 'vzMax') {
    if (qualifiers && values.some((v) => qualifierAt(qualifiers, v.cell))) {
      for (const v of values) {
        const q = qualifierAt(qualifiers, v.cell);
        if (q === 'min') chosen.push(['vzMin', v]);
        else if (q === 'typ' || q === 'nom') chosen.push(['vzNom', v]);
        else if (q === 'max') chosen.push(['vzMax', v]);
      }
    } else if (match.qualifier) chosen.push([f, values[0]]);
    else if (values.length === 3) chosen.push(['vzMin', values[0]], ['vzNom', values[1]], ['vzMax', values[2]]);
    else {
      chosen.push(['vzNom', values[0]]);
      unqualifiedVz = true;
    }
  } else if (f === 'tc') {
    const v = qualifiers ? byQualifier(['typ', 'nom']) : match.rank > 0 ? values[0] : undefined;
    if (v) chosen.push([f, v]);
  } else if (f === 'zzt' || f === 'zzk' || f === 'irMax' || f === 'izm') {
    const v = qualifiers ? byQualifier(['max', 'typ', 'nom']) : values[0];
    if (v) chosen.push([f, v]);
  } else chosen.push([f, values[0]]);

  for (const [field, v] of chosen) {
    const unit = unitFor(v);
    const k = unit ? unitKind(unit) : undefined;
    if (!k || !FIELD_KINDS[field].includes(k)) continue;
    const si = toSi(v.token.value, unit, k);
    if (si === undefined) continue;
    const offer: Offer = { value: v.token.value, unit, kind: k, si, page: line.page, text: line.printed, box: cellBox(v.cell), rank: 2, method };
    if (unqualifiedVz) vz.unqualifiedLine(draft, offer);
    else {
      if (field === 'vzMin' || field === 'vzNom' || field === 'vzMax') vz.qualifiedLine(field, si);
      draft().offer(field, offer);
    }
  }
  // Test conditions on the line: "IZ = 5 mA" on a VZ line is IZT, on a ZZK line IZK; "VR = 2 V" on an IR line.
  for (const cell of line.cells) {
    for (const cond of findConditions(cell.text, f).conditions) {
      const usable = cond.field === 'vr' ? f === 'irMax' : f !== 'irMax' && f !== 'vr';
      if (!usable) continue;
      const si = toSi(cond.value, cond.unit, cond.kind);
      if (si === undefined) continue;
      draft().offer(cond.field, {
        value: cond.value,
        unit: cond.unit,
        kind: cond.kind,
        si,
        page: line.page,
        text: line.printed,
        box: cellBox(cell),
        rank: 1,
        method,
      });
    }
  }
}
