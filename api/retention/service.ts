/**
 * Retention: what the nightly job prunes, and what deleting a person forgets.
 *
 * - Sessions past their expiry (set by SESSION_IDLE_MINUTES and the session lifetime).
 * - Mail whose delivery is finished, older than the `sentMailRetentionDays` setting.
 * - Alerts nobody has read, older than the `unreadAlertRetentionDays` setting; alerts
 *   someone read stay, and a run's estimates (what the alert described) are never touched.
 *
 * A person deleted by an admin loses their sessions and subscriptions (and with their user
 * row their read marks and pending mail); their audit entries stay, under a pseudonym.
 */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import { getSettings } from '../settings/service';
import * as store from './store';

const DAY_MS = 24 * 60 * 60 * 1000;

export interface PruneResult {
  sessions: number;
  mail: number;
  alerts: number;
}

/** One pass of the retention rules; audited (as the system) when it removed anything. */
export async function pruneExpired(db: Knex, now = new Date()): Promise<PruneResult> {
  const s = await getSettings(db);
  return db.transaction(async (trx) => {
    const result: PruneResult = {
      sessions: await store.pruneExpiredSessions(trx, now),
      mail: await store.pruneFinishedMail(trx, new Date(now.getTime() - s.sentMailRetentionDays * DAY_MS)),
      alerts: await store.pruneUnreadAlerts(trx, new Date(now.getTime() - s.unreadAlertRetentionDays * DAY_MS)),
    };
    if (result.sessions + result.mail + result.alerts > 0) {
      await audit.record(trx, {
        actorId: null,
        actorEmail: null,
        action: 'retention.prune',
        targetType: 'retention',
        after: {
          ...result,
          sentMailRetentionDays: s.sentMailRetentionDays,
          unreadAlertRetentionDays: s.unreadAlertRetentionDays,
        },
      });
    }
    return result;
  });
}

/** A fresh pseudonym: no link to the address, one per deleted person. */
export function newPseudonym(): string {
  return `former-person-${randomBytes(5).toString('hex')}`;
}

export interface ForgetResult {
  pseudonym: string;
  sessions: number;
  subscriptions: number;
  auditEntries: number;
}

/** Inside the caller's transaction, before the user row is deleted. */
export async function forgetPerson(trx: Knex, person: { id: number; email: string }): Promise<ForgetResult> {
  const pseudonym = newPseudonym();
  const sessions = await store.deleteSessionsOf(trx, person.id);
  const subscriptions = await store.deleteSubscriptionsOf(trx, person.id);
  const auditEntries = await store.pseudonymise(trx, { userId: person.id, email: person.email, pseudonym });
  return { pseudonym, sessions, subscriptions, auditEntries };
}
