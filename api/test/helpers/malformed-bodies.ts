import fc from 'fast-check';
import { z, type ZodType } from 'zod';

/**
 * Malformed request bodies derived from a contracts schema. The schema is read through
 * zod's own JSON Schema output (input side); every generated body carries at least one
 * "poison": a change that the schema (or the API's global text pipe) must refuse, with the
 * path the refusal should name. Bodies are otherwise the smallest plausible value.
 */
type Json = Record<string, unknown>;
type Path = Array<string | number>;

export interface Poison {
  kind: string;
  /** Where the refusal should point ('' = the body itself). */
  path: Path;
  apply(body: unknown): unknown;
}

export interface MalformedBody {
  poisons: Poison[];
  /** The JSON text to send (may hold literals JSON.stringify cannot write, such as 1e999). */
  text: string;
}

const RAW = '\uE000raw:';
/** A placeholder for a JSON literal written verbatim into the text (e.g. 1e999, which parses to Infinity). */
const raw = (literal: string) => `${RAW}${literal}`;
const serialise = (body: unknown) => JSON.stringify(body).replace(new RegExp(`"${RAW}([^"]*)"`, 'g'), '$1');

export function jsonSchemaOf(schema: ZodType): Json {
  return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', cycles: 'ref', reused: 'inline' }) as Json;
}

function resolve(node: Json, root: Json): Json {
  const ref = node.$ref as string | undefined;
  if (!ref) return node;
  if (ref === '#') return root;
  const name = ref.replace(/^#\/\$defs\//, '');
  return ((root.$defs as Record<string, Json> | undefined)?.[name] ?? {}) as Json;
}

const branches = (node: Json): Json[] | null => (node.anyOf ?? node.oneOf ?? null) as Json[] | null;

/** The JSON types a node accepts, or null for "anything". */
function typesOf(node: Json, root: Json): Set<string> | null {
  node = resolve(node, root);
  const b = branches(node);
  if (b) {
    const all = new Set<string>();
    for (const branch of b) {
      const t = typesOf(branch, root);
      if (!t) return null;
      t.forEach((x) => all.add(x));
    }
    return all;
  }
  if (node.allOf) return typesOf((node.allOf as Json[])[0], root);
  if (node.const !== undefined) return new Set([node.const === null ? 'null' : typeof node.const]);
  if (Array.isArray(node.enum)) return new Set((node.enum as unknown[]).map((v) => (v === null ? 'null' : typeof v)));
  const t = node.type;
  if (t === undefined) return null;
  const list = (Array.isArray(t) ? t : [t]) as string[];
  return new Set(list.flatMap((x) => (x === 'integer' ? ['number'] : [x])));
}

/** The smallest plausible value of a node (not necessarily valid: poisons make bodies invalid, not bases). */
export function baseValue(node: Json, root: Json, depth = 0): unknown {
  node = resolve(node, root);
  if (depth > 12) return null;
  const b = branches(node);
  if (b) return baseValue(b.find((x) => resolve(x, root).type !== 'null') ?? b[0], root, depth + 1);
  if (node.allOf) return baseValue((node.allOf as Json[])[0], root, depth + 1);
  if (node.const !== undefined) return node.const;
  if (Array.isArray(node.enum)) return (node.enum as unknown[])[0];
  const type = Array.isArray(node.type) ? (node.type as string[])[0] : node.type;
  switch (type) {
    case 'object': {
      const out: Record<string, unknown> = {};
      const props = (node.properties ?? {}) as Record<string, Json>;
      for (const key of (node.required ?? []) as string[]) out[key] = baseValue(props[key] ?? {}, root, depth + 1);
      return out;
    }
    case 'array':
      return Array.from({ length: Number(node.minItems ?? 0) }, () => baseValue((node.items ?? {}) as Json, root, depth + 1));
    case 'string':
      if (node.format === 'email') return 'fuzz@demo.test';
      return 'x'.repeat(Math.max(1, Number(node.minLength ?? 1)));
    case 'integer':
    case 'number': {
      const lo = (node.minimum ?? node.exclusiveMinimum) as number | undefined;
      const hi = (node.maximum ?? node.exclusiveMaximum) as number | undefined;
      const v = lo !== undefined && hi !== undefined ? (lo + hi) / 2 : lo !== undefined ? lo + 1 : hi !== undefined ? hi - 1 : 1;
      return type === 'integer' ? Math.round(v) : v;
    }
    case 'boolean':
      return true;
    case 'null':
      return null;
    default:
      return 'x';
  }
}

function setAt(body: unknown, path: Path, value: unknown, remove = false): unknown {
  if (path.length === 0) return value;
  const root = (body !== null && typeof body === 'object' ? body : {}) as Record<string | number, unknown>;
  let target = root;
  for (const key of path.slice(0, -1)) {
    const next = target[key];
    target = (next !== null && typeof next === 'object' ? next : (target[key] = {})) as Record<string | number, unknown>;
  }
  const last = path[path.length - 1];
  if (remove) delete target[last];
  else Object.defineProperty(target, last, { value, enumerable: true, writable: true, configurable: true });
  return root;
}

const CONTROL = ['\u0000', '\u0001', '\u0007', '\u0008', '\u001b', '\u007f'];
const SURROGATES = ['\ud800', '\udbff', '\udc00', '\udfff'];
const textWith = (chars: string[]) =>
  fc.tuple(fc.string({ maxLength: 12 }), fc.constantFrom(...chars), fc.string({ maxLength: 12 })).map(([a, c, b]) => `${a}${c}${b}`);
const deeplyNested = fc.integer({ min: 70, max: 3000 }).map((depth) => {
  let v: unknown = 'leaf';
  for (let i = 0; i < depth; i++) v = i % 2 ? { k: v } : [v];
  return v;
});
/** A value of each JSON type, to put where the schema wants another type. */
const VALUE_OF: Record<string, fc.Arbitrary<unknown>> = {
  string: fc.oneof(fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e999', 'not a value'), fc.string({ minLength: 1, maxLength: 20 })),
  number: fc.oneof(fc.constantFrom(0, -1, 1.5, 1e308, -1e308), fc.double({ noNaN: true, noDefaultInfinity: true })),
  boolean: fc.boolean(),
  null: fc.constant(null),
  object: fc.constantFrom({}, { a: 1 }),
  array: fc.constantFrom([], [1, 'two'], [[]]),
};

interface Site {
  path: Path;
  node: Json;
  /** The non-null branch of a nullable node: only its bounds are poisons (null is a valid value there). */
  boundsOnly?: boolean;
}

/** Every place in the body the schema describes (optional and nested ones included), at most a few levels deep. */
function sitesOf(node: Json, root: Json, path: Path = [], depth = 0): Site[] {
  node = resolve(node, root);
  const out: Site[] = [{ path, node }];
  if (depth > 6) return out;
  const b = branches(node);
  if (b) {
    const nonNull = b.filter((x) => resolve(x, root).type !== 'null');
    if (nonNull.length === 1)
      out.push(
        ...sitesOf(nonNull[0], root, path, depth + 1)
          .slice(1)
          .concat(branchBounds(nonNull[0], root, path, b.length > 1)),
      );
    return out;
  }
  if (node.type === 'object' && node.properties) {
    for (const [key, child] of Object.entries(node.properties as Record<string, Json>)) out.push(...sitesOf(child, root, [...path, key], depth + 1));
  }
  if (node.type === 'array' && node.items && !Array.isArray(node.items)) out.push(...sitesOf(node.items as Json, root, [...path, 0], depth + 1));
  return out;
}

/** The one non-null branch of a nullable node, so its bounds are checked too (null stays allowed, the bound still fails). */
function branchBounds(node: Json, root: Json, path: Path, nullable: boolean): Site[] {
  const n = resolve(node, root);
  return nullable && (n.type === 'number' || n.type === 'integer' || n.type === 'string' || n.type === 'array') ? [{ path, node: n, boundsOnly: true }] : [];
}

/** The poisons that make a body invalid at one site, each certain to be refused. */
function poisonsAt(site: Site, root: Json, strictParents: Set<string>): Array<fc.Arbitrary<Poison>> {
  const { path, node } = site;
  const at = (kind: string, value: fc.Arbitrary<unknown>, where: Path = path): fc.Arbitrary<Poison> =>
    value.map((v) => ({ kind, path: where, apply: (body: unknown) => setAt(body, path, v) }));
  // The API's text pipe refuses these anywhere, whatever the schema says.
  // (Not as the whole body: a bare string is not JSON the API's parser takes at all.)
  const out: Array<fc.Arbitrary<Poison>> = [at('deep nesting', deeplyNested)];
  if (path.length > 0) out.push(at('control character', textWith(CONTROL)), at('lone surrogate', textWith(SURROGATES)));
  const types = site.boundsOnly ? null : typesOf(node, root);
  if (types) {
    const wrong = Object.keys(VALUE_OF).filter((t) => !types.has(t) && !(t === 'number' && types.has('integer')));
    if (path.length === 0) wrong.splice(0, wrong.length, ...wrong.filter((t) => t === 'array'));
    if (wrong.length) out.push(fc.constantFrom(...wrong).chain((t) => at(`wrong type (${t})`, VALUE_OF[t])));
    if (types.has('number') && types.size === 1)
      out.push(at('Infinity (1e999)', fc.constant(raw('1e999'))), at('-Infinity (-1e999)', fc.constant(raw('-1e999'))));
  }
  const type = node.type;
  if (type === 'number' || type === 'integer') {
    const min = node.minimum as number | undefined;
    const xmin = node.exclusiveMinimum as number | undefined;
    const max = node.maximum as number | undefined;
    const xmax = node.exclusiveMaximum as number | undefined;
    if ((min !== undefined && min > 0) || (xmin !== undefined && xmin >= 0)) out.push(at('zero or negative', fc.constantFrom(0, -0.001, -1, -1e300)));
    if (min !== undefined && min > 1e-300) out.push(at('tiny', fc.constant(Math.min(1e-300, min / 10))));
    if (min !== undefined) out.push(at('below minimum', fc.double({ min: -1e300, max: min - Math.max(1, Math.abs(min)), noNaN: true })));
    if (xmin !== undefined) out.push(at('at exclusive minimum', fc.constant(xmin)));
    if (max !== undefined) out.push(at('above maximum', fc.double({ min: max + Math.max(1, Math.abs(max)), max: 1e300, noNaN: true })));
    if (xmax !== undefined) out.push(at('at exclusive maximum', fc.constant(xmax)));
    if (max === undefined && xmax === undefined && (min !== undefined || xmin !== undefined)) out.push(at('huge', fc.constant(1e300)));
    if (type === 'integer') out.push(at('fraction', fc.constantFrom(0.5, 1.5, 2.000001)));
  }
  if (type === 'string') {
    const maxLength = node.maxLength as number | undefined;
    if (maxLength !== undefined && maxLength < 1_500_000) {
      out.push(
        at(
          'huge string',
          fc.integer({ min: maxLength + 1, max: Math.max(maxLength + 1, Math.min(200_000, maxLength * 50)) }).map((n) => 'x'.repeat(n)),
        ),
      );
    }
    if (Number(node.minLength ?? 0) >= 1 && !node.pattern) out.push(at('empty string', fc.constant('')));
    if (Array.isArray(node.enum)) out.push(at('not one of the choices', fc.constantFrom('not-a-choice', 'DRAFT ', '')));
    if (node.format === 'email') out.push(at('not an e-mail', fc.constantFrom('no-at-sign', '@', 'a@')));
  }
  if (type === 'array') {
    if (node.maxItems !== undefined && Number(node.maxItems) < 5000) {
      const item = baseValue((node.items ?? {}) as Json, root);
      out.push(at('too many items', fc.constant(Array.from({ length: Number(node.maxItems) + 1 }, () => item))));
    }
    if (Number(node.minItems ?? 0) >= 1) out.push(at('too few items', fc.constant([])));
  }
  if (type === 'object') {
    for (const key of (node.required ?? []) as string[]) {
      out.push(fc.constant<Poison>({ kind: `missing ${key}`, path: [...path, key], apply: (body) => setAt(body, [...path, key], undefined, true) }));
    }
    if (node.additionalProperties === false || strictParents.has(path.join('.'))) {
      out.push(
        fc.constantFrom('__proto__', 'constructor', 'prototype', 'unexpected', 'isAdmin').map<Poison>((key) => ({
          kind: `extra field ${key}`,
          path,
          apply: (body) => setAt(body, [...path, key], key === '__proto__' ? { role: 'admin', polluted: true } : 'extra'),
        })),
      );
    }
  }
  return out;
}

/** Malformed bodies for one schema: 1–3 poisons applied to its smallest plausible value. */
export function malformedBodies(schema: ZodType): fc.Arbitrary<MalformedBody> {
  const root = jsonSchemaOf(schema);
  const sites = sitesOf(root, root);
  const poisons = sites.flatMap((s) => poisonsAt(s, root, new Set()));
  return fc.array(fc.oneof(...poisons), { minLength: 1, maxLength: 3 }).map((chosen) => {
    let body: unknown = structuredClone(baseValue(root, root));
    for (const p of chosen) body = p.apply(body);
    return { poisons: chosen, text: serialise(body) };
  });
}

/** Whether an error path (as the API writes it: dot-joined, '(body)' for the root) points at a poison. */
export function namesPoison(errorPath: string, poison: Poison): boolean {
  const p = poison.path.join('.');
  // A poison on the whole body (a wrong type, deep nesting) may be named at the body or anywhere inside it.
  if (p === '') return true;
  return errorPath === p || p.startsWith(`${errorPath}.`) || errorPath.startsWith(`${p}.`);
}
