/**
 * The small schema language the contracts are written in. It has the names and shapes of
 * zod/mini (object, nullable, optional, enum, extend, …) and does two things: it infers the
 * TypeScript types, and it parses an answer (checking every field, dropping fields an
 * object does not name). It imports nothing, so the app's bundle carries a few hundred lines
 * instead of zod; the server turns each schema into a zod 4 schema (api/http/contract-zod.ts)
 * for JSON Schema and OpenAPI.
 */

/** A schema for values of type T (T is only for the type checker). */
export interface Schema<T = unknown> {
  readonly node: Node;
  /** phantom: carries T for `infer` */
  readonly _type?: T;
}

export type Node =
  | { kind: 'string' | 'number' | 'boolean' | 'unknown' }
  | { kind: 'literal'; value: string | number | boolean }
  | { kind: 'enum'; values: readonly string[] }
  | { kind: 'nullable' | 'optional' | 'array'; of: Schema }
  | { kind: 'object'; shape: Shape; loose: boolean }
  | { kind: 'record'; keys: readonly string[] | null; value: Schema }
  | { kind: 'tuple'; items: readonly Schema[] }
  | { kind: 'union'; options: readonly Schema[]; discriminator: string | null };

export type Shape = { readonly [key: string]: Schema<unknown> };

type Infer<S> = S extends Schema<infer T> ? T : never;
export type { Infer as infer };

/** Marks optional object keys. */
interface OptionalSchema<T> extends Schema<T | undefined> {
  readonly optional: true;
}

type Flat<T> = { [K in keyof T]: T[K] } & {};
type OptionalKeys<S extends Shape> = { [K in keyof S]: S[K] extends OptionalSchema<unknown> ? K : never }[keyof S];
export type ObjectOf<S extends Shape> = Flat<
  { -readonly [K in Exclude<keyof S, OptionalKeys<S>>]: Infer<S[K]> } & {
    -readonly [K in OptionalKeys<S>]?: Infer<S[K]>;
  }
>;

export interface ObjectSchema<S extends Shape, T = ObjectOf<S>> extends Schema<T> {
  readonly shape: S;
}

const make = <T>(node: Node): Schema<T> => ({ node });

export const string = () => make<string>({ kind: 'string' });
export const number = () => make<number>({ kind: 'number' });
export const boolean = () => make<boolean>({ kind: 'boolean' });
export const unknown = () => make<unknown>({ kind: 'unknown' });
export const literal = <const V extends string | number | boolean>(value: V) => make<V>({ kind: 'literal', value });
// `enum` is a reserved word: exported under that name as zod does.
const enumOf = <const V extends readonly string[]>(values: V) => make<V[number]>({ kind: 'enum', values });
export { enumOf as enum };
export const nullable = <T>(of: Schema<T>) => make<T | null>({ kind: 'nullable', of });
export const optional = <T>(of: Schema<T>): OptionalSchema<T> => ({ node: { kind: 'optional', of }, optional: true });
export const array = <T>(of: Schema<T>) => make<T[]>({ kind: 'array', of });

export function object<S extends Shape>(shape: S): ObjectSchema<S> {
  return { node: { kind: 'object', shape, loose: false }, shape };
}

/** An object that keeps the fields it does not name (typed as unknown). */
export function looseObject<S extends Shape>(shape: S): ObjectSchema<S, ObjectOf<S> & { [key: string]: unknown }> {
  return { node: { kind: 'object', shape, loose: true }, shape };
}

export function extend<S extends Shape, E extends Shape>(
  base: ObjectSchema<S>,
  more: E,
): ObjectSchema<Omit<S, keyof E> & E> {
  return object({ ...base.shape, ...more } as Omit<S, keyof E> & E);
}

export function pick<S extends Shape, K extends keyof S & string>(
  base: ObjectSchema<S>,
  keys: { [P in K]: true },
): ObjectSchema<Pick<S, K>> {
  const shape: Record<string, Schema> = {};
  for (const k of Object.keys(keys)) shape[k] = base.shape[k];
  return object(shape as Pick<S, K>);
}

export const record = <V>(_key: Schema<string>, value: Schema<V>) =>
  make<Record<string, V>>({ kind: 'record', keys: null, value });

/** A record whose keys are some of an enum's values. */
export function partialRecord<K extends string, V>(key: Schema<K>, value: Schema<V>): Schema<Partial<Record<K, V>>> {
  const keys = key.node.kind === 'enum' ? key.node.values : [];
  return make({ kind: 'record', keys, value });
}

export const tuple = <const T extends readonly Schema[]>(items: T) =>
  make<{ -readonly [I in keyof T]: Infer<T[I]> }>({ kind: 'tuple', items });

export const union = <const T extends readonly Schema[]>(options: T) =>
  make<Infer<T[number]>>({ kind: 'union', options, discriminator: null });

export const discriminatedUnion = <const T extends readonly Schema[]>(discriminator: string, options: T) =>
  make<Infer<T[number]>>({ kind: 'union', options, discriminator });

// ---- Parsing -----------------------------------------------------------------------------

export type Issue = { path: (string | number)[]; message: string };
export type ParseResult<T> = { success: true; data: T } | { success: false; issues: Issue[] };

const MAX_ISSUES = 20;

function kindOf(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'array';
  return typeof v;
}

function walk(schema: Schema, value: unknown, path: (string | number)[], issues: Issue[]): unknown {
  if (issues.length >= MAX_ISSUES) return value;
  const fail = (message: string) => {
    issues.push({ path, message });
    return value;
  };
  const node = schema.node;
  switch (node.kind) {
    case 'unknown':
      return value;
    case 'string':
    case 'boolean':
      return typeof value === node.kind ? value : fail(`expected ${node.kind}, received ${kindOf(value)}`);
    case 'number':
      return typeof value === 'number' && Number.isFinite(value)
        ? value
        : fail(`expected number, received ${kindOf(value)}`);
    case 'literal':
      return value === node.value ? value : fail(`expected ${JSON.stringify(node.value)}`);
    case 'enum':
      return typeof value === 'string' && node.values.includes(value)
        ? value
        : fail(`expected one of ${node.values.join(', ')}`);
    case 'nullable':
      return value === null ? null : walk(node.of, value, path, issues);
    case 'optional':
      return value === undefined ? undefined : walk(node.of, value, path, issues);
    case 'array':
      if (!Array.isArray(value)) return fail(`expected array, received ${kindOf(value)}`);
      return value.map((item, i) => walk(node.of, item, [...path, i], issues));
    case 'tuple':
      if (!Array.isArray(value) || value.length !== node.items.length)
        return fail(`expected ${node.items.length} items`);
      return node.items.map((item, i) => walk(item, value[i], [...path, i], issues));
    case 'object': {
      if (kindOf(value) !== 'object') return fail(`expected object, received ${kindOf(value)}`);
      const source = value as Record<string, unknown>;
      const out: Record<string, unknown> = node.loose ? { ...source } : {};
      for (const [key, field] of Object.entries(node.shape)) {
        const got = walk(field, source[key], [...path, key], issues);
        if (got !== undefined || key in source) out[key] = got;
      }
      return out;
    }
    case 'record': {
      if (kindOf(value) !== 'object') return fail(`expected object, received ${kindOf(value)}`);
      const out: Record<string, unknown> = {};
      for (const [key, item] of Object.entries(value as Record<string, unknown>)) {
        if (node.keys && !node.keys.includes(key)) {
          issues.push({ path: [...path, key], message: `unexpected key; expected one of ${node.keys.join(', ')}` });
          continue;
        }
        out[key] = walk(node.value, item, [...path, key], issues);
      }
      return out;
    }
    case 'union': {
      if (node.discriminator !== null && kindOf(value) === 'object') {
        const tag = (value as Record<string, unknown>)[node.discriminator];
        const match = node.options.find((o) => {
          const n = o.node;
          if (n.kind !== 'object') return false;
          const d = n.shape[node.discriminator!]?.node;
          return d?.kind === 'literal' && d.value === tag;
        });
        return match
          ? walk(match, value, path, issues)
          : fail(`no variant with ${node.discriminator} ${JSON.stringify(tag)}`);
      }
      for (const option of node.options) {
        const trial: Issue[] = [];
        const got = walk(option, value, path, trial);
        if (trial.length === 0) return got;
      }
      return fail('matches none of the allowed shapes');
    }
  }
}

/** Checks `value` against `schema`: the value (objects without unnamed fields), or every issue with its path. */
export function safeParse<T>(schema: Schema<T>, value: unknown): ParseResult<T> {
  const issues: Issue[] = [];
  const data = walk(schema, value, [], issues);
  return issues.length === 0 ? { success: true, data: data as T } : { success: false, issues };
}

/** Like safeParse, but throws an Error listing the issues. */
export function parse<T>(schema: Schema<T>, value: unknown): T {
  const r = safeParse(schema, value);
  if (!r.success) throw new Error(`Does not match its contract: ${describeIssues(r.issues)}`);
  return r.data;
}

/** "districts.0.code: expected string, received number; …" */
export function describeIssues(issues: Issue[]): string {
  return issues.map((i) => `${i.path.join('.') || '(value)'}: ${i.message}`).join('; ');
}
