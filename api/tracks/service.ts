/**
 * Tracks: what the agency watches. A track names an emissions indicator and the saved spec
 * its next run uses; runs, published estimates, alerts and subscriptions belong to one.
 * Admins create, rename, pause, archive and choose the headline track; staff change a
 * track's spec (same emissions indicator). Without a track named, reads mean the headline.
 */
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import { lockForTransaction } from '../db/locks';
import { AppError, NotFoundError } from '../http/errors';
import type { Caller } from '../http/routes';
import { getSpec, starterSpec } from '../specs/service';
import type { IndicatorLabel, Track, TrackCreateInput, TrackPatchInput, TrackRef } from '../../contracts/tracks';
import * as store from './store';

export type { TrackRow } from './store';

/** A code from an indicator's code, as the tracks migration derives it (`emissions_pc` → `emissions-pc`). */
export function codeFromIndicator(indicator: string): string {
  const code = indicator
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^[^a-z]+|-+$/g, '')
    .slice(0, 32);
  return code || 'track';
}

/** The catalogue's labels of these indicators; one the catalogue lacks is named by its code, without a unit. */
export async function indicatorLabels(db: Knex, codes: string[]): Promise<Map<string, IndicatorLabel>> {
  const found = await store.indicatorLabels(db, codes);
  for (const c of codes) if (!found.has(c)) found.set(c, { code: c, name: c, unit: '', source: null, licence: null });
  return found;
}

export async function trackRef(db: Knex, t: store.TrackRow): Promise<TrackRef> {
  const labels = await indicatorLabels(db, [t.emissionsIndicator]);
  return { code: t.code, name: t.name, indicator: labels.get(t.emissionsIndicator)! };
}

/** The headline track; when no track exists yet, one is made from the starting spec (the library's oldest). */
export async function headlineTrack(db: Knex): Promise<store.TrackRow> {
  const chosen = await currentHeadline(db);
  if (chosen) return chosen;
  return db.transaction(async (trx) => {
    await lockForTransaction(trx, 'headlineTrack');
    const again = await currentHeadline(trx);
    if (again) return again;
    const spec = await starterSpec(trx);
    const existing = await store.findByIndicator(trx, spec.emissionsIndicator);
    const id =
      existing?.id ??
      (await store.insert(trx, {
        code: codeFromIndicator(spec.emissionsIndicator),
        name: (await indicatorLabels(trx, [spec.emissionsIndicator])).get(spec.emissionsIndicator)!.name,
        emissionsIndicator: spec.emissionsIndicator,
        specId: spec.id,
        createdBy: null,
      }));
    const track = (await store.findById(trx, id))!;
    await store.setHeadlineCode(trx, track.code, null);
    return track;
  });
}

/** The setting's track if it is there and not archived, else the first track not archived. */
async function currentHeadline(db: Knex): Promise<store.TrackRow | null> {
  const code = await store.headlineCode(db);
  const named = code ? await store.findByCode(db, code) : null;
  if (named && named.state !== 'archived') return named;
  return (await store.list(db)).find((t) => t.state !== 'archived') ?? null;
}

/** The track a read or a run names (404 when unknown), or the headline track when none is named. */
export async function resolveTrack(db: Knex, code?: string | null): Promise<store.TrackRow> {
  if (!code) return headlineTrack(db);
  const t = await store.findByCode(db, code);
  if (!t) throw new NotFoundError(`No track "${code}"`, { track: code });
  return t;
}

export async function trackById(db: Knex, id: number): Promise<store.TrackRow> {
  const t = await store.findById(db, id);
  if (!t) throw new NotFoundError(`No track ${id}`, { id });
  return t;
}

/** Every track (any state) by id. */
export async function tracksById(db: Knex): Promise<Map<number, store.TrackRow>> {
  return new Map((await store.list(db)).map((t) => [t.id, t]));
}

/** Tracks officials see (not archived), the headline first, then in creation order. */
export async function shownTracks(db: Knex): Promise<store.TrackRow[]> {
  const headline = await headlineTrack(db);
  const all = await store.list(db);
  return [headline, ...all.filter((t) => t.id !== headline.id && t.state !== 'archived')];
}

/** Tracks the schedule and "re-estimate all" start runs for. */
export async function activeTracks(db: Knex): Promise<store.TrackRow[]> {
  return (await shownTracks(db)).filter((t) => t.state === 'active');
}

/** Every track (any state) with its indicator label and whether it is the headline. */
export async function listTracks(db: Knex): Promise<Track[]> {
  const headline = await headlineTrack(db);
  const all = await store.list(db);
  const labels = await indicatorLabels(
    db,
    all.map((t) => t.emissionsIndicator),
  );
  const ordered = [headline, ...all.filter((t) => t.id !== headline.id)].map((t) => all.find((a) => a.id === t.id)!);
  return ordered.map((t) => viewOf(t, labels, headline.id));
}

function viewOf(t: store.TrackRow, labels: Map<string, IndicatorLabel>, headlineId: number): Track {
  return {
    code: t.code,
    name: t.name,
    indicator: labels.get(t.emissionsIndicator)!,
    headline: t.id === headlineId,
    state: t.state,
    specId: t.specId,
    specName: t.specName,
    publishedRunId: t.publishedRunId,
    publishedAt: t.publishedAt,
    createdAt: t.createdAt,
  };
}

async function answerFor(db: Knex, code: string): Promise<Track> {
  const t = (await store.findByCode(db, code))!;
  const headline = await headlineTrack(db);
  return viewOf(t, await indicatorLabels(db, [t.emissionsIndicator]), headline.id);
}

/** Ids of the tracks with these codes; an unknown code is a 400 naming it. */
export async function trackIds(db: Knex, codes: string[]): Promise<number[]> {
  const found = await store.idsByCodes(db, [...new Set(codes)]);
  const unknown = codes.filter((c) => !found.some((f) => f.code === c));
  if (unknown.length)
    throw new AppError(400, 'unknown_track', `Unknown track: ${unknown.join(', ')}`, { unknown, field: 'tracks' });
  return found.map((f) => f.id);
}

export const trackCodes = (db: Knex, ids: number[]) => store.codesByIds(db, ids);

const unique = (err: unknown) => (err as { code?: string }).code === '23505';

export async function createTrack(db: Knex, caller: Caller, input: TrackCreateInput): Promise<Track> {
  await headlineTrack(db);
  const spec = await getSpec(db, input.specId);
  if (spec.archived) throw new AppError(409, 'spec_archived', `Spec "${spec.name}" is archived.`);
  await db.transaction(async (trx) => {
    try {
      const id = await store.insert(trx, {
        code: input.code,
        name: input.name,
        emissionsIndicator: spec.emissionsIndicator,
        specId: spec.id,
        createdBy: caller.id,
      });
      await audit.record(trx, {
        actorId: caller.id,
        actorEmail: caller.email,
        action: 'track.create',
        targetType: 'track',
        targetId: id,
        after: { code: input.code, name: input.name, indicator: spec.emissionsIndicator, specId: spec.id },
      });
    } catch (err) {
      if (unique(err)) throw new AppError(409, 'code_taken', `A track with code "${input.code}" exists already.`);
      throw err;
    }
  });
  return answerFor(db, input.code);
}

export async function patchTrack(db: Knex, caller: Caller, code: string, input: TrackPatchInput): Promise<Track> {
  const before = await resolveTrack(db, code);
  const headline = await headlineTrack(db);
  const state = input.state ?? before.state;
  if (state === 'archived' && (input.headline || headline.id === before.id))
    throw new AppError(
      409,
      'headline_required',
      'The headline track cannot be archived: choose another headline first.',
    );
  await db.transaction(async (trx) => {
    await store.update(trx, before.id, { name: input.name, state: input.state });
    if (input.headline) await store.setHeadlineCode(trx, before.code, caller.id);
    await audit.record(trx, {
      actorId: caller.id,
      actorEmail: caller.email,
      action: 'track.update',
      targetType: 'track',
      targetId: before.id,
      before: { name: before.name, state: before.state, headline: headline.id === before.id },
      after: { ...input },
    });
  });
  return answerFor(db, code);
}

/** The track takes up a saved spec (same emissions indicator); its next run uses it. */
export async function setTrackSpec(db: Knex, caller: Caller, code: string, specId: number): Promise<Track> {
  const track = await resolveTrack(db, code);
  if (track.state === 'archived') throw new AppError(409, 'track_archived', `Track "${code}" is archived.`);
  const spec = await getSpec(db, specId);
  if (spec.archived) throw new AppError(409, 'spec_archived', `Spec "${spec.name}" is archived.`);
  if (spec.emissionsIndicator !== track.emissionsIndicator)
    throw new AppError(
      400,
      'indicator_mismatch',
      `Spec "${spec.name}" models ${spec.emissionsIndicator}; track "${code}" watches ${track.emissionsIndicator}.`,
      { field: 'specId', specIndicator: spec.emissionsIndicator, trackIndicator: track.emissionsIndicator },
    );
  await db.transaction(async (trx) => {
    await store.update(trx, track.id, { specId: spec.id });
    await audit.record(trx, {
      actorId: caller.id,
      actorEmail: caller.email,
      action: 'track.spec',
      targetType: 'track',
      targetId: track.id,
      before: { specId: track.specId },
      after: { specId: spec.id },
    });
  });
  return answerFor(db, code);
}
