/**
 * Published answers (region, district list, card, history; each per track) change only when
 * a run of any track is published, a track changes, a note is edited, data are loaded or reverted, or districts are added. Each is
 * built once per version and kept per process as its serialised JSON; the ETag names the
 * version, so a device that already holds it gets `304 Not Modified` and no body at all.
 * `Cache-Control: private, no-cache` makes browsers ask every time (cheap: one small
 * statement), never show a stale answer, and never let a shared cache keep one.
 *
 * The version itself is read once and then kept while nothing changed: the tables it is
 * read from notify on commit (migration 20261205020000) and each process listens, so a
 * publish made through another process shows as soon as PostgreSQL delivers the
 * notification (milliseconds). A write made through this process forgets the kept version
 * at once, without waiting: every write statement's answer through this process's Knex, and
 * the end of every state-changing request. While the listening connection is down the
 * version is read on every request, as before, and listening is tried again at most every
 * RELISTEN_MS.
 */
import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import { headlineTrack } from '../tracks/service';
import { listenForPublishedChanges, publishedVersion } from './store';

/** Answers kept per process; the oldest go first (a region of 3,000 districts holds ~3,000 cards). */
const MAX_ANSWERS = 5_000;

type Kept = { etag: string; body: string };
/** One cache per database (tests run several databases in one process). */
const caches = new WeakMap<Knex, Map<string, Kept>>();

/** Answers being built, by key and version (one build however many ask at once). */
const builds = new WeakMap<Knex, Map<string, Promise<Kept>>>();

function buildingFor(db: Knex): Map<string, Promise<Kept>> {
  let b = builds.get(db);
  if (!b) builds.set(db, (b = new Map()));
  return b;
}

function cacheFor(db: Knex): Map<string, Kept> {
  let c = caches.get(db);
  if (!c) caches.set(db, (c = new Map()));
  return c;
}

const RELISTEN_MS = 5_000;
/** Statements that may change what the version is read from (the version query is a plain WITH … SELECT). */
const WRITE = /^\s*(insert|update|delete|copy|truncate|commit|merge)\b|^\s*with\b[\s\S]*\b(insert|update|delete)\b/i;

type Version = { version: string; tracks: number };
interface Watch {
  state: 'starting' | 'listening' | 'down';
  /** Moves on every change heard of; a kept version is good only for the generation it was read in. */
  generation: number;
  kept?: { generation: number; value: Promise<Version> };
  downSince: number;
}
const watches = new WeakMap<Knex, Watch>();

function changed(w: Watch): void {
  w.generation++;
  w.kept = undefined;
}

function listen(db: Knex, w: Watch): void {
  w.state = 'starting';
  listenForPublishedChanges(db, {
    changed: () => changed(w),
    lost: () => {
      w.state = 'down';
      w.downSince = Date.now();
      changed(w);
    },
  }).then(
    () => {
      // Anything kept from before listening began is not trusted.
      changed(w);
      if (w.state === 'starting') w.state = 'listening';
    },
    () => {
      w.state = 'down';
      w.downSince = Date.now();
    },
  );
}

function watchFor(db: Knex): Watch {
  let w = watches.get(db);
  if (!w) {
    const watch: Watch = { state: 'down', generation: 0, downSince: 0 };
    watches.set(db, watch);
    db.on('query-response', (_r: unknown, q: { sql?: string }) => {
      if (WRITE.test(q.sql ?? '')) changed(watch);
    });
    db.on('query', (q: { sql?: string }) => {
      if (/^\s*commit\b/i.test(q.sql ?? '')) changed(watch);
    });
    w = watch;
  }
  if (w.state === 'down' && Date.now() - w.downSince >= RELISTEN_MS) listen(db, w);
  return w;
}

/** A state-changing request through this process has ended: read the version again. */
export function publishedMayHaveChanged(db: Knex): void {
  const w = watches.get(db);
  if (w) changed(w);
}

/** The published version: kept while listening and nothing changed, else read. */
export function currentPublishedVersion(db: Knex): Promise<Version> {
  const w = watchFor(db);
  if (w.state !== 'listening') return publishedVersion(db);
  if (w.kept?.generation === w.generation) return w.kept.value;
  const kept = { generation: w.generation, value: publishedVersion(db) };
  w.kept = kept;
  kept.value.catch(() => {
    if (w.kept === kept) w.kept = undefined;
  });
  return kept.value;
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
  const first = await currentPublishedVersion(db);
  let version = first.version;
  if (first.tracks === 0) {
    // The first read of a new region makes the headline track (the answer names it): version it after that.
    await headlineTrack(db);
    ({ version } = await currentPublishedVersion(db));
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
    // Requests that arrive while the same answer is being built wait for that one build
    // (after a publish, a hundred officials opening the region build it once, not a hundred times).
    const pending = buildingFor(db);
    const id = `${key}\n${etag}`;
    let building = pending.get(id);
    if (!building) {
      building = (async () => {
        const made = { etag, body: JSON.stringify(await build()) };
        cache.delete(key);
        if (cache.size >= MAX_ANSWERS) cache.delete(cache.keys().next().value as string);
        cache.set(key, made);
        return made;
      })().finally(() => pending.delete(id));
      pending.set(id, building);
    }
    kept = await building;
  }
  res.type('application/json').send(kept.body);
}
