/**
 * Published answers (region, district list, card, history; each per track) change only when
 * a run of any track is published, a track changes, a note is edited, data are loaded or reverted, or districts are added. Each is
 * built once per version and kept per process as its serialised JSON; the ETag names the
 * version, so a device that already holds it gets `304 Not Modified` and no body at all.
 * `Cache-Control: private, no-cache` makes browsers ask every time (cheap: one small
 * statement), never show a stale answer, and never let a shared cache keep one.
 */
import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import { headlineTrack } from '../tracks/service';
import { publishedVersion } from './store';

/** Answers kept per process; the oldest go first (a region of 3,000 districts holds ~3,000 cards). */
const MAX_ANSWERS = 5_000;

type Kept = { etag: string; body: string };
/** One cache per database (tests run several databases in one process). */
const caches = new WeakMap<Knex, Map<string, Kept>>();

function cacheFor(db: Knex): Map<string, Kept> {
  let c = caches.get(db);
  if (!c) caches.set(db, (c = new Map()));
  return c;
}

/**
 * Answers `key` (the route and its parameters) from the cache when its version is current,
 * with 304 when the caller already holds it; otherwise builds, keeps and sends it.
 */
export async function sendPublished(
  db: Knex,
  req: Request,
  res: Response,
  key: string,
  build: () => Promise<unknown>,
): Promise<void> {
  const first = await publishedVersion(db);
  let version = first.version;
  if (first.tracks === 0) {
    // The first read of a new region makes the headline track (the answer names it): version it after that.
    await headlineTrack(db);
    ({ version } = await publishedVersion(db));
  }
  const etag = `"p-${createHash('sha1').update(`${key}\n${version}`).digest('base64url').slice(0, 22)}"`;
  res.set('ETag', etag);
  res.set('Cache-Control', 'private, no-cache');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  const cache = cacheFor(db);
  let kept = cache.get(key);
  if (!kept || kept.etag !== etag) {
    const body = JSON.stringify(await build());
    kept = { etag, body };
    cache.delete(key);
    if (cache.size >= MAX_ANSWERS) cache.delete(cache.keys().next().value as string);
    cache.set(key, kept);
  }
  res.type('application/json').send(kept.body);
}
