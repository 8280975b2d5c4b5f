/**
 * A small JSON Schema (draft 2020-12) checker for the keywords the log file's schema uses, and no others.
 *
 * ajv is too big for the phone's precache and compiles validators with `new Function`, which a strict
 * Content-Security-Policy forbids; its ahead-of-time output is larger still. This interprets the schema, after
 * one compile step (cached per schema object) that resolves every `$ref` and builds every `pattern` once.
 * Semantics follow JSON Schema Core and Validation 2020-12: `$ref` applies beside its sibling keywords,
 * "integer" is any number without a fractional part (1.0 is one), additional properties are those not named in
 * `properties` of the same schema object, `then`/`else` apply by the outcome of `if`, whose own failures are
 * never reported. A schema using any keyword outside KEYWORDS throws 'schema-keyword-unsupported', so a later
 * change of the schema cannot quietly be checked less strictly than it says.
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export interface JsonSchemaProblem {
  /** JSON Pointer (RFC 6901) of the offending value, e.g. "/records/3/mass_kg"; for a missing or an extra
   *  property, the pointer of that property. */
  path: string;
  /** The schema keyword that failed, e.g. "exclusiveMinimum". */
  keyword: string;
  /** The offending value (undefined for a missing property). */
  value: unknown;
  /** For a person: "/records/3/mass_kg: -2 must be > 0 and ≤ 1000". */
  message: string;
}

export type JsonSchemaErrorCode = 'schema-keyword-unsupported' | 'schema-invalid';

/** A schema this checker cannot apply faithfully. `field` is the schema location, e.g. "#/$defs/id/format". */
export class JsonSchemaError extends PlummetError<JsonSchemaErrorCode> {
  declare readonly field: string;
  constructor(options: PlummetErrorOptions<JsonSchemaErrorCode> & { field: string }) {
    super(options);
    this.name = 'JsonSchemaError';
  }
}

const DRAFT = 'https://json-schema.org/draft/2020-12/schema';
/** The JSON types as bits, so a `type` test is one AND. "number" includes "integer". */
const TYPES: Record<string, number> = { null: 1, boolean: 2, object: 4, array: 8, integer: 16, number: 48, string: 64 };
const [NULL, BOOLEAN, OBJECT, ARRAY, INTEGER, FRACTION, STRING_TYPE] = [1, 2, 4, 8, 16, 32, 64];

type Shape = [test: (v: unknown) => boolean, description: string];
const isObject = (v: unknown) => typeof v === 'object' && v !== null && !Array.isArray(v);
const isSchema = (v: unknown) => typeof v === 'boolean' || isObject(v);
const isType = (v: unknown) => typeof v === 'string' && Object.hasOwn(TYPES, v);
const list = (each: (v: unknown) => boolean, min = 1) => (v: unknown) => Array.isArray(v) && v.length >= min && v.every(each);
const ANY: Shape = [() => true, ''];
const STRING: Shape = [(v) => typeof v === 'string', 'a string'];
const NUMBER: Shape = [(v) => typeof v === 'number' && Number.isFinite(v), 'a number'];
const SCHEMA: Shape = [isSchema, 'a schema'];
const SCHEMAS: Shape = [list(isSchema), 'a non-empty array of schemas'];
const SCHEMA_MAP: Shape = [(v) => isObject(v) && Object.values(v as object).every(isSchema), 'an object of schemas'];

/** Every keyword this checker knows and the shape its value must have; the last line never changes an outcome. */
const KEYWORDS: Record<string, Shape> = {
  $schema: [(v) => v === DRAFT, `"${DRAFT}"`], $id: STRING, $defs: SCHEMA_MAP, $ref: STRING,
  type: [(v) => isType(v) || list(isType)(v), `one of ${Object.keys(TYPES).join(', ')}, or a list of them`],
  const: ANY, enum: [list(() => true), 'a non-empty array'], pattern: STRING,
  minimum: NUMBER, maximum: NUMBER, exclusiveMinimum: NUMBER,
  required: [list((v) => typeof v === 'string', 0), 'an array of strings'], properties: SCHEMA_MAP, additionalProperties: SCHEMA,
  items: SCHEMA, // an array of schemas here is the draft 2019 form, not 2020-12
  minItems: [(v) => Number.isInteger(v) && (v as number) >= 0, 'an integer ≥ 0'],
  allOf: SCHEMAS, anyOf: SCHEMAS, if: SCHEMA, then: SCHEMA, else: SCHEMA,
  $comment: ANY, title: ANY, description: ANY, default: ANY, examples: ANY, deprecated: ANY, readOnly: ANY, writeOnly: ANY,
};
export const SUPPORTED_KEYWORDS: readonly string[] = Object.keys(KEYWORDS);

/** One schema object after compiling (a boolean schema is `always` true or false); `source` is the pattern text. */
interface Node {
  always?: boolean; ref?: Node; types?: string[]; accepts?: number; constant?: { v: unknown }; choices?: unknown[];
  pattern?: RegExp; source?: string; minimum?: number; maximum?: number; exclusiveMinimum?: number; minItems?: number;
  required?: string[]; keys?: string[]; values?: Node[]; inherited?: boolean[]; slots?: Map<string, Slot>;
  additional?: Node; items?: Node; allOf?: Node[]; anyOf?: Node[]; if?: Node; then?: Node; else?: Node;
}
/** A property name of an object schema: its schema if `properties` names it (else additionalProperties applies),
 *  and whether it is required. */
interface Slot { node: Node | undefined; required: boolean }

/** Every node gets every field, in one order: one object shape keeps V8's property loads in check() fast. */
const blank = (): Node => ({
  always: undefined, ref: undefined, types: undefined, accepts: undefined, constant: undefined, choices: undefined,
  pattern: undefined, source: undefined, minimum: undefined, maximum: undefined, exclusiveMinimum: undefined,
  minItems: undefined, required: undefined, keys: undefined, values: undefined, inherited: undefined, slots: undefined,
  additional: undefined, items: undefined, allOf: undefined, anyOf: undefined, if: undefined, then: undefined, else: undefined,
});

function compileRoot(root: object): Node {
  const memo = new Map<object, Node>();
  const id = typeof (root as { $id?: unknown }).$id === 'string' ? (root as { $id: string }).$id.replace(/#$/, '') : null;
  const fail = (at: string, value: unknown, why: string, allowed: string | null = null): never => {
    throw new JsonSchemaError({ code: 'schema-invalid', field: at, value, allowed, message: `${at}: ${show(value)} ${why}` });
  };
  const resolve = (ref: string, at: string): unknown => {
    const local = id !== null && ref.startsWith(`${id}#`) ? ref.slice(id.length) : ref;
    if (!local.startsWith('#/') && local !== '#') fail(at, ref, 'is not supported: only "#/…" pointers into this schema');
    let target: unknown = root;
    for (const raw of local === '#' ? [] : local.slice(2).split('/')) {
      const token = decodeURIComponent(raw).replace(/~1/g, '/').replace(/~0/g, '~'); // RFC 6901, section 4
      if (typeof target !== 'object' || target === null || !Object.hasOwn(target, token)) fail(at, ref, 'points at nothing');
      target = (target as Record<string, unknown>)[token];
    }
    return target;
  };

  function compile(schema: unknown, at: string): Node {
    if (typeof schema === 'boolean') return { ...blank(), always: schema };
    const known = memo.get(schema as object);
    if (known) return known;
    const node = blank();
    memo.set(schema as object, node); // before the children, so a $ref cycle ends here
    const s = schema as Record<string, unknown>;
    for (const k of Object.keys(s)) {
      const shape = KEYWORDS[k];
      if (!shape) {
        const why = `${at}: the keyword "${k}" is not supported by checkJsonSchema (supported: ${SUPPORTED_KEYWORDS.join(', ')})`;
        throw new JsonSchemaError({ code: 'schema-keyword-unsupported', field: `${at}/${k}`, value: s[k], allowed: `one of ${SUPPORTED_KEYWORDS.join(', ')}`, message: why });
      }
      if (!shape[0](s[k])) fail(`${at}/${k}`, s[k], `must be ${shape[1]}`, shape[1]);
    }
    // Only the root may name the dialect and the base URI: a nested $id would change what a $ref points at.
    if (at !== '#' && (s.$schema ?? s.$id) !== undefined) fail(at, s.$schema ?? s.$id, 'is only supported at the root');
    for (const [k, v] of Object.entries(s.$defs ?? {})) compile(v, `${at}/$defs/${k}`); // unused ones are checked too
    if (s.$ref !== undefined) node.ref = compile(resolve(s.$ref as string, `${at}/$ref`), s.$ref as string);
    if (s.type !== undefined) {
      node.types = Array.isArray(s.type) ? (s.type as string[]) : [s.type as string];
      node.accepts = node.types.reduce((bits, x) => bits | TYPES[x]!, 0);
    }
    if (Object.hasOwn(s, 'const')) node.constant = { v: s.const };
    node.choices = s.enum as unknown[] | undefined;
    if (s.pattern !== undefined) {
      node.source = s.pattern as string;
      try {
        node.pattern = new RegExp(node.source, 'u'); // ECMA-262 (Validation 2020-12, 6.3.3); ajv also uses "u"
      } catch {
        fail(`${at}/pattern`, s.pattern, 'is not a valid ECMA-262 regular expression');
      }
    }
    Object.assign(node, { minimum: s.minimum, maximum: s.maximum, exclusiveMinimum: s.exclusiveMinimum });
    Object.assign(node, { minItems: s.minItems, required: s.required });
    if (s.properties !== undefined) {
      node.keys = Object.keys(s.properties as object);
      node.values = node.keys.map((k) => compile((s.properties as Record<string, unknown>)[k], `${at}/properties/${k}`));
      // "constructor" and the like are on every object's prototype: only those need an own-property test.
      node.inherited = node.keys.map((k) => k in Object.prototype);
    }
    if (s.additionalProperties !== undefined) {
      node.additional = compile(s.additionalProperties, `${at}/additionalProperties`);
      node.slots = new Map(node.keys?.map((k, i) => [k, { node: node.values![i], required: false }]));
      for (const k of node.required ?? []) node.slots.set(k, { node: node.slots.get(k)?.node, required: true });
    }
    if (s.items !== undefined) node.items = compile(s.items, `${at}/items`);
    for (const k of ['allOf', 'anyOf'] as const) {
      if (s[k] !== undefined) node[k] = (s[k] as unknown[]).map((v, i) => compile(v, `${at}/${k}/${i}`));
    }
    for (const k of ['if', 'then', 'else'] as const) if (s[k] !== undefined) node[k] = compile(s[k], `${at}/${k}`);
    // A schema that is only a $ref (most properties of the log schema) is its target: one call less per value.
    if (node.ref && Object.values(node).filter((x) => x !== undefined).length === 1) memo.set(s, node.ref);
    return memo.get(s)!;
  }
  if (!isObject(root)) fail('#', root, 'must be a schema object');
  return compile(root, '#');
}

/** Equality of JSON values (Validation 2020-12, 4.2.2): key order does not matter, 1 and 1.0 are equal. */
function same(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) || Array.isArray(b)) {
    return Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((x, i) => same(x, b[i]));
  }
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => Object.hasOwn(b, k) && same((a as never)[k], (b as never)[k]));
}

/** The type bit of a value; 0 for what JSON cannot hold (undefined, NaN, Infinity, a function). */
function typeOf(v: unknown): number {
  if (v === null) return NULL;
  switch (typeof v) {
    case 'object': return Array.isArray(v) ? ARRAY : OBJECT;
    case 'number': return Number.isInteger(v) ? INTEGER : Number.isFinite(v) ? FRACTION : 0;
    case 'boolean': return BOOLEAN;
    case 'string': return STRING_TYPE;
    default: return 0;
  }
}

function show(v: unknown): string {
  const text = JSON.stringify(v) ?? String(v);
  return text.length > 60 ? `${text.slice(0, 57)}…` : text;
}

const pointer = (path: string, key: string | number): string =>
  `${path}/${typeof key === 'number' ? key : key.replace(/~/g, '~0').replace(/\//g, '~1')}`;

/** The rule a keyword of `n` states, in words; built only when a problem is reported. */
function rule(n: Node, keyword: string): string {
  switch (keyword) {
    case 'type': return `must be ${n.types!.map((x) => (x === 'null' ? x : /^[aeiou]/.test(x) ? `an ${x}` : `a ${x}`)).join(' or ')}`;
    case 'const': return `must be ${show(n.constant!.v)}`;
    case 'enum': return `must be one of ${n.choices!.map(show).join(', ')}`;
    case 'pattern': return `must match the pattern ${n.source}`;
    case 'minItems': return `must have at least ${n.minItems} item${n.minItems === 1 ? '' : 's'}`;
    case 'required': return 'is required but missing';
    case 'additionalProperties': return 'is not an allowed property here';
    case 'false': return 'is not allowed here';
  }
  // A bound: name the whole allowed range, not only the side that was crossed.
  const low = n.exclusiveMinimum !== undefined && !(n.exclusiveMinimum < (n.minimum ?? -Infinity))
    ? `> ${n.exclusiveMinimum}` : n.minimum !== undefined ? `≥ ${n.minimum}` : '';
  return `must be ${[low, n.maximum !== undefined ? `≤ ${n.maximum}` : ''].filter(Boolean).join(' and ')}`;
}

interface Sink {
  out: JsonSchemaProblem[];
  /** The rule of each problem without path and value, to put the alternatives of an anyOf into one sentence. */
  rules: string[];
  max: number;
}

/** True when checking should stop: answering valid-or-not only, or the sink is full. */
const stops = (sink: Sink | null): boolean => !sink || sink.out.length >= sink.max;

function report(sink: Sink, path: string, keyword: string, value: unknown, rule: string): void {
  if (stops(sink)) return;
  sink.out.push({ path, keyword, value, message: `${path || '(root)'}: ${value === undefined ? '' : `${show(value)} `}${rule}` });
  sink.rules.push(rule);
}

/** Notes a broken keyword of `n`; true when the caller should stop. */
function miss(sink: Sink | null, n: Node, keyword: string, path: string, value: unknown): boolean {
  if (sink) report(sink, path, keyword, value, rule(n, keyword));
  return stops(sink);
}

function anyPasses(nodes: Node[], v: unknown): boolean {
  for (const n of nodes) if (check(n, v, '', null)) return true;
  return false;
}

function among(choices: unknown[], v: unknown): boolean {
  for (const c of choices) if (same(v, c)) return true;
  return false;
}

/** True when an alternative failed only because the value has another type: it says nothing useful. */
const otherType = (s: Sink, path: string): boolean => s.out.length === 1 && s.out[0]!.keyword === 'type' && s.out[0]!.path === path;

/**
 * Applies `n` to `v`. With `sink` null it only answers valid or not and stops at the first failure (for `if`,
 * `anyOf` and the first pass over a whole file: no paths, no messages); with a sink it records every problem,
 * up to sink.max. After a `type` failure the other keywords of that schema object are not reported: they would
 * only say the same again. No closures in here: this runs for every value of a file.
 */
function check(n: Node, v: unknown, path: string, sink: Sink | null): boolean {
  if (n.always !== undefined) return n.always || (miss(sink, n, 'false', path, v), false);
  let ok = true;
  if (n.ref && !check(n.ref, v, path, sink) && ((ok = false), stops(sink))) return false;
  const t = typeOf(v);
  if (n.accepts !== undefined && !(n.accepts & t)) return miss(sink, n, 'type', path, v), false;
  if (n.constant && !same(v, n.constant.v) && ((ok = false), miss(sink, n, 'const', path, v))) return false;
  if (n.choices && !among(n.choices, v) && ((ok = false), miss(sink, n, 'enum', path, v))) return false;
  if (n.pattern && typeof v === 'string' && !n.pattern.test(v) && ((ok = false), miss(sink, n, 'pattern', path, v))) return false;
  if (t & (INTEGER | FRACTION)) {
    const x = v as number;
    const broken = n.minimum !== undefined && x < n.minimum ? 'minimum'
      : n.exclusiveMinimum !== undefined && x <= n.exclusiveMinimum ? 'exclusiveMinimum'
      : n.maximum !== undefined && x > n.maximum ? 'maximum' : null;
    if (broken && ((ok = false), miss(sink, n, broken, path, v))) return false;
  } else if (t === OBJECT) {
    const o = v as Record<string, unknown>;
    let present = 0;
    if (n.slots) {
      // Every key has to be looked at anyway; V8 reads o[k] fast inside for-in (ajv walks additional
      // properties with for-in too). Required keys are counted on the way and searched for only if some are missing.
      for (const k in o) {
        const x = o[k];
        if (x === undefined) continue;
        const slot = n.slots.get(k);
        if (slot?.required) present++;
        const sub = slot?.node ?? n.additional!;
        const at = sink ? pointer(path, k) : '';
        const good = !slot?.node && sub.always === false ? (miss(sink, n, 'additionalProperties', at, x), false) : check(sub, x, at, sink);
        if (!good && ((ok = false), stops(sink))) return false;
      }
    } else if (n.keys) {
      for (let i = 0; i < n.keys.length; i++) {
        const k = n.keys[i]!;
        const x = o[k];
        if (x === undefined || (n.inherited![i] && !Object.hasOwn(o, k))) continue;
        if (!check(n.values![i]!, x, sink ? pointer(path, k) : '', sink) && ((ok = false), stops(sink))) return false;
      }
    }
    if (n.required && (!n.slots || present < n.required.length)) {
      for (const k of n.required) {
        if (o[k] !== undefined && Object.hasOwn(o, k)) continue;
        if (((ok = false), miss(sink, n, 'required', sink ? pointer(path, k) : '', undefined))) return false;
      }
    }
  } else if (t === ARRAY) {
    const a = v as unknown[];
    if (n.minItems !== undefined && a.length < n.minItems && ((ok = false), miss(sink, n, 'minItems', path, v))) return false;
    if (n.items) {
      for (let i = 0; i < a.length; i++) {
        if (!check(n.items, a[i], sink ? pointer(path, i) : '', sink) && ((ok = false), stops(sink))) return false;
      }
    }
  }
  if (n.allOf) for (const s of n.allOf) if (!check(s, v, path, sink) && ((ok = false), stops(sink))) return false;
  if (n.anyOf && !anyPasses(n.anyOf, v)) {
    if (!sink) return false;
    ok = false;
    // Only now, on failure, ask each alternative what it wanted. When all but one merely wanted another
    // type (a nullable number given 80), that one's own problems say it best.
    const tries = n.anyOf.map((s) => {
      const inner: Sink = { out: [], rules: [], max: sink.max };
      check(s, v, path, inner);
      return inner;
    });
    const near = tries.filter((s) => !otherType(s, path));
    if (near.length === 1) near[0]!.out.forEach((p, i) => report(sink, p.path, p.keyword, p.value, near[0]!.rules[i]!));
    else {
      const wanted = tries.map((s) => s.out.map((p, i) => (p.path === path ? s.rules[i] : p.message)).join(' and '));
      report(sink, path, 'anyOf', v, wanted.join(', or '));
    }
    if (stops(sink)) return false;
  }
  if (n.if) {
    const branch = check(n.if, v, path, null) ? n.then : n.else;
    if (branch && !check(branch, v, path, sink) && ((ok = false), stops(sink))) return false;
  }
  return ok;
}

const compiled = new WeakMap<object, Node>();

/**
 * Checks `value` against `schema` (JSON Schema 2020-12, the keywords in SUPPORTED_KEYWORDS only) and returns
 * the problems found, at most `maxErrors` (default 100); an empty list means valid. Throws JsonSchemaError when
 * the schema uses a keyword this does not support, or is malformed. The compiled schema is cached per schema
 * object: do not change a schema object after its first use.
 */
export function checkJsonSchema(schema: object, value: unknown, options: { maxErrors?: number } = {}): JsonSchemaProblem[] {
  let root = compiled.get(schema);
  if (!root) compiled.set(schema, (root = compileRoot(schema)));
  if (check(root, value, '', null)) return [];
  const sink: Sink = { out: [], rules: [], max: Math.max(1, options.maxErrors ?? 100) };
  check(root, value, '', sink);
  return sink.out;
}
