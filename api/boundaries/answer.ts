/**
 * The encoded answers of GET /api/boundaries, kept per (boundary version, detail): the
 * JSON text, its gzip and a strong ETag. A version's boundaries never change once written,
 * so an answer is built once (topology, simplification, gzip) and reused; a few recent
 * ones are kept.
 */
import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import type { Knex } from 'knex';
import type { BoundaryCollection } from '../../lib/map-scene';
import { simplifiedCollection, type Detail } from './geometry';
import * as store from './store';

const gzipAsync = promisify(gzip);

export interface EncodedAnswer {
  version: number | null;
  json: Buffer;
  gzip: Buffer;
  etag: string;
}

const KEPT = 8;
const cache = new Map<string, Promise<EncodedAnswer>>();

async function build(db: Knex, version: number | null, detail: Detail): Promise<EncodedAnswer> {
  const rows = version === null ? [] : await store.versionGeometry(db, version);
  const json = Buffer.from(JSON.stringify(simplifiedCollection(rows, version, detail)));
  const hash = createHash('sha256').update(json).digest('hex').slice(0, 16);
  return { version, json, gzip: await gzipAsync(json, { level: 9 }), etag: `"b${version ?? 0}-${detail}-${hash}"` };
}

/** The answer for a version (null: none loaded), built once per database, version and detail. */
export function encodedAnswer(db: Knex, version: number | null, detail: Detail): Promise<EncodedAnswer> {
  const conn = (db.client as { config?: { connection?: unknown } }).config?.connection;
  const key = `${JSON.stringify(conn)}|${version}|${detail}`;
  let hit = cache.get(key);
  if (!hit) {
    hit = build(db, version, detail);
    hit.catch(() => cache.delete(key));
    cache.set(key, hit);
    while (cache.size > KEPT) cache.delete(cache.keys().next().value!);
  }
  return hit;
}

/** The current boundaries as an object (the briefs' maps): null when none are loaded. */
export async function currentCollection(db: Knex, detail: Detail): Promise<BoundaryCollection | null> {
  const version = await store.currentVersionId(db);
  if (version === null) return null;
  return JSON.parse((await encodedAnswer(db, version, detail)).json.toString('utf8')) as BoundaryCollection;
}
