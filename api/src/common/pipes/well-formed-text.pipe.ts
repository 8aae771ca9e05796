import { BadRequestException, Injectable, type ArgumentMetadata, type PipeTransform } from '@nestjs/common';

/** A high surrogate not followed by a low one, or a low one without a high one before it. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
/** C0 controls other than tab, line feed and carriage return, and DEL: no text field has a use for them. */
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;
const MAX_DEPTH = 64;

/**
 * Runs before validation on every body, query and route parameter: a string holding a lone
 * UTF-16 surrogate (JSON can carry "\ud800") cannot be stored as UTF-8, so it is refused
 * here with a 400 naming the field rather than failing in the database; so is a control
 * character other than tab and line breaks (NUL, escape, backspace …), which no text field
 * needs and which can hide text from reviewers and logs. Keys are checked too. Buffers (an uploaded file) are not text and are skipped; nesting deeper than
 * MAX_DEPTH is refused outright.
 */
@Injectable()
export class WellFormedTextPipe implements PipeTransform {
  transform(value: unknown, metadata: ArgumentMetadata): unknown {
    if (metadata.type === 'custom') return value;
    const problem = findProblem(value, [], 0);
    if (problem) {
      const where = [metadata.type === 'body' ? null : metadata.type, ...problem.path].filter((p) => p !== null && p !== '').join('.') || '(body)';
      throw new BadRequestException({ message: `Invalid request: ${where}: ${problem.message}`, errors: [{ path: where, message: problem.message }] });
    }
    return value;
  }
}

function findProblem(value: unknown, path: string[], depth: number): { path: string[]; message: string } | null {
  if (typeof value === 'string') {
    if (LONE_SURROGATE.test(value)) return { path, message: 'contains a lone UTF-16 surrogate (not valid Unicode text)' };
    if (CONTROL.test(value)) return { path, message: 'contains a control character (only tab and line breaks are allowed in text)' };
    return null;
  }
  if (value === null || typeof value !== 'object' || Buffer.isBuffer(value) || ArrayBuffer.isView(value)) return null;
  if (depth >= MAX_DEPTH) return { path, message: `is nested deeper than ${MAX_DEPTH} levels` };
  const entries: Array<[string, unknown]> = Array.isArray(value) ? value.map((v, i) => [String(i), v]) : Object.entries(value);
  for (const [key, inner] of entries) {
    if (LONE_SURROGATE.test(key) || CONTROL.test(key))
      return { path: [...path, '(key)'], message: 'a key contains a lone UTF-16 surrogate or a control character' };
    const found = findProblem(inner, [...path, key], depth + 1);
    if (found) return found;
  }
  return null;
}
