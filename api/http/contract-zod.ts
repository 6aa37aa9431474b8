/**
 * A contract (contracts/kit.ts) as a zod 4 schema, for zod's JSON Schema output (OpenAPI).
 * One zod schema per contract schema (memoised), so a contract used in many places is one
 * object to the generator.
 */
import { z } from 'zod';
import type { Schema } from '../../contracts/kit';

const made = new WeakMap<Schema, z.ZodType>();

export function toZod(schema: Schema): z.ZodType {
  const known = made.get(schema);
  if (known) return known;
  const out = build(schema);
  made.set(schema, out);
  return out;
}

function build(schema: Schema): z.ZodType {
  const node = schema.node;
  switch (node.kind) {
    case 'string':
      return z.string();
    case 'number':
      return z.number();
    case 'boolean':
      return z.boolean();
    case 'unknown':
      return z.unknown();
    case 'literal':
      return z.literal(node.value);
    case 'enum':
      return z.enum(node.values as [string, ...string[]]);
    case 'nullable':
      return toZod(node.of).nullable();
    case 'optional':
      return toZod(node.of).optional();
    case 'array':
      return z.array(toZod(node.of));
    case 'tuple':
      return z.tuple(node.items.map(toZod) as [z.ZodType, ...z.ZodType[]]);
    case 'object': {
      const shape = Object.fromEntries(Object.entries(node.shape).map(([k, v]) => [k, toZod(v)]));
      return node.loose ? z.looseObject(shape) : z.object(shape);
    }
    case 'record':
      return node.keys
        ? z.partialRecord(z.enum(node.keys as [string, ...string[]]), toZod(node.value))
        : z.record(z.string(), toZod(node.value));
    case 'union': {
      const options = node.options.map(toZod) as [z.ZodType, ...z.ZodType[]];
      return node.discriminator
        ? z.discriminatedUnion(node.discriminator, options as unknown as [z.ZodObject, ...z.ZodObject[]])
        : z.union(options);
    }
  }
}
