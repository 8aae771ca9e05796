import { normaliseQuantityText } from '@shuntwise/contracts';

/** A piece of text on a rendered page, with its rectangle in CSS pixels of the page. */
export interface TextRun {
  text: string;
  left: number;
  top: number;
  width: number;
  height: number;
}

export interface Rect {
  left: number;
  top: number;
  width: number;
  height: number;
}

const norm = (s: string) => normaliseQuantityText(s).replace(/\s+/g, ' ').trim().toLowerCase();

/** Runs on one printed line: their vertical centres lie within half a line height. */
function lines(runs: readonly TextRun[]): TextRun[][] {
  const sorted = runs.filter((r) => norm(r.text) !== '').sort((a, b) => a.top + a.height / 2 - (b.top + b.height / 2));
  const out: TextRun[][] = [];
  for (const run of sorted) {
    const centre = run.top + run.height / 2;
    const line = out.at(-1);
    const lineCentre = line ? line[0].top + line[0].height / 2 : NaN;
    if (line && Math.abs(centre - lineCentre) <= Math.max(2, run.height / 2)) line.push(run);
    else out.push([run]);
  }
  return out.map((line) => line.sort((a, b) => a.left - b.left));
}

/**
 * Finds the printed line a value was read from, for a datasheet's text layer when the
 * extraction gave no box: the line whose runs cover most of the wanted text. Null when
 * no line shares enough of it (then the viewer only turns to the page).
 */
export function findTextRuns(runs: readonly TextRun[], wanted: string): TextRun[] | null {
  const target = norm(wanted);
  if (target.length === 0) return null;
  let best: { runs: TextRun[]; score: number } | null = null;
  for (const line of lines(runs)) {
    const joined = norm(line.map((r) => r.text).join(' '));
    let matched: TextRun[];
    let score: number;
    if (joined.includes(target)) {
      // The whole wanted text is on this line: keep the runs that are part of it.
      matched = line.filter((r) => target.includes(norm(r.text)));
      if (matched.length === 0) matched = line;
      score = target.length * 2;
    } else {
      matched = line.filter((r) => {
        const t = norm(r.text);
        return (t.length >= 2 || /\d/.test(t)) && target.includes(t);
      });
      score = matched.reduce((sum, r) => sum + norm(r.text).length, 0);
    }
    if (matched.length > 0 && (!best || score > best.score)) best = { runs: matched, score };
  }
  if (!best || best.score < Math.min(4, target.length)) return null;
  return best.runs;
}

/** The rectangle around some runs. */
export function unionRect(runs: readonly Rect[]): Rect {
  const left = Math.min(...runs.map((r) => r.left));
  const top = Math.min(...runs.map((r) => r.top));
  const right = Math.max(...runs.map((r) => r.left + r.width));
  const bottom = Math.max(...runs.map((r) => r.top + r.height));
  return { left, top, width: right - left, height: bottom - top };
}
