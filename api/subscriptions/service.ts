/**
 * Subscriptions to alerts: a district, a set of districts, or the whole region; in every
 * track ('all', including tracks created later) or in the tracks chosen.
 */
import type { Knex } from 'knex';
import type { Config } from '../config';
import { districtsByCodes } from '../districts/service';
import { AppError, NotFoundError } from '../http/errors';
import type { Caller } from '../http/routes';
import { ALERT_KINDS, type AlertKind } from '../common/alert-kinds';
import { trackIds } from '../tracks/service';
import * as store from './store';
import { checkUnsubscribeToken, unsubscribeToken } from './token';

export type { SubscriptionRow } from './store';

export interface SubscriptionInput {
  scope: 'district' | 'districts' | 'region';
  districtCodes: string[];
  kinds: AlertKind[];
  delivery: 'instant' | 'digest';
  attachBrief: boolean;
  tracks: 'all' | string[];
}

export const publicSubscription = (s: store.SubscriptionRow) => ({
  id: s.id,
  scope: s.scope,
  districtCodes: s.districtCodes,
  kinds: s.kinds,
  delivery: s.delivery,
  attachBrief: s.attachBrief,
  tracks: s.allTracks ? ('all' as const) : s.trackCodes,
  createdAt: s.createdAt,
});

/** Whether a subscription covers an alert of this track. */
export const coversTrack = (s: store.SubscriptionRow, trackId: number) => s.allTracks || s.trackIds.includes(trackId);

export async function listOwn(db: Knex, caller: Caller) {
  return (await store.listForUser(db, caller.id)).map(publicSubscription);
}

export async function subscribe(db: Knex, caller: Caller, input: SubscriptionInput) {
  const codes = [...new Set(input.districtCodes)];
  if (input.scope === 'region' && codes.length)
    throw new AppError(400, 'invalid_request', 'A region subscription names no districts.');
  if (input.scope === 'district' && codes.length !== 1)
    throw new AppError(400, 'invalid_request', 'A district subscription names exactly one district.');
  if (input.scope === 'districts' && codes.length < 1)
    throw new AppError(400, 'invalid_request', 'Name at least one district.');
  const found = await districtsByCodes(db, codes);
  const tracks = input.tracks === 'all' ? [] : await trackIds(db, input.tracks);
  if (input.tracks !== 'all' && !tracks.length)
    throw new AppError(400, 'invalid_request', 'Name at least one track, or choose all tracks.', { field: 'tracks' });
  const id = await store.insert(db, {
    allTracks: input.tracks === 'all',
    trackIds: tracks,
    userId: caller.id,
    scope: input.scope,
    districtIds: found.map((f) => f.id),
    kinds: input.kinds.length ? [...new Set(input.kinds)] : [...ALERT_KINDS],
    delivery: input.delivery,
    attachBrief: input.attachBrief,
  });
  return publicSubscription((await store.find(db, id))!);
}

export async function unsubscribeOwn(db: Knex, caller: Caller, id: number): Promise<void> {
  const s = await store.find(db, id);
  if (!s || s.userId !== caller.id) throw new NotFoundError(`No subscription ${id} of yours`, { id });
  await store.remove(db, id);
}

export async function unsubscribeByToken(
  db: Knex,
  secret: string,
  token: string,
): Promise<{ ok: boolean; message: string }> {
  const check = checkUnsubscribeToken(secret, token);
  if (!check.ok) {
    const message =
      check.reason === 'expired'
        ? 'This unsubscribe link has expired. Sign in to manage your alerts.'
        : 'This unsubscribe link is not valid.';
    return { ok: false, message };
  }
  const removed = await store.remove(db, check.subscriptionId);
  return {
    ok: true,
    message: removed
      ? 'You will get no more e-mails from this subscription.'
      : 'This subscription had already been removed.',
  };
}

/** Active people's subscriptions with their e-mail address (whom a publish may alert). */
export function activeSubscribers(db: Knex): Promise<(store.SubscriptionRow & { email: string })[]> {
  return store.subscribersFor(db);
}

/** The signed link that ends one subscription without signing in. */
export function unsubscribeUrl(config: Pick<Config, 'publicUrl' | 'sessionSecret'>, subscriptionId: number): string {
  return `${config.publicUrl}/api/subscriptions/unsubscribe?token=${unsubscribeToken(config.sessionSecret, subscriptionId)}`;
}
