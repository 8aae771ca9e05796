import { BadRequestException, Injectable, type ArgumentMetadata, type PipeTransform } from '@nestjs/common';

/** A high surrogate not followed by a low one, or a low one without a high one before it. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const MAX_DEPTH = 64;

/**
 * Runs before validation on every body, query and route parameter: a string holding a lone
 * UTF-16 surrogate (JSON can carry "\ud800") cannot be stored as UTF-8, so it is refused
 * here with a 400 naming the field rather than failing in the database. Keys are checked
 * too. Buffers (an uploaded file) are not text and are skipped; nesting deeper than
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
  if (typeof value === 'string') return LONE_SURROGATE.test(value) ? { path, message: 'contains a lone UTF-16 surrogate (not valid Unicode text)' } : null;
  if (value === null || typeof value !== 'object' || Buffer.isBuffer(value) || ArrayBuffer.isView(value)) return null;
  if (depth >= MAX_DEPTH) return { path, message: `is nested deeper than ${MAX_DEPTH} levels` };
  const entries: Array<[string, unknown]> = Array.isArray(value) ? value.map((v, i) => [String(i), v]) : Object.entries(value);
  for (const [key, inner] of entries) {
    if (LONE_SURROGATE.test(key)) return { path: [...path, '(key)'], message: 'a key contains a lone UTF-16 surrogate' };
    const found = findProblem(inner, [...path, key], depth + 1);
    if (found) return found;
  }
  return null;
}
