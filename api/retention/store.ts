/** Retention: the SQL that prunes old rows and forgets a deleted person. */
import type { Knex } from 'knex';

const count = (r: { rowCount?: number | null }) => r.rowCount ?? 0;

/** Sessions past their expiry (idle timeout or lifetime): the session store's own clock. */
export async function pruneExpiredSessions(db: Knex, now: Date): Promise<number> {
  return count(await db.raw(`DELETE FROM session WHERE expire < ?`, [now]));
}

/**
 * Mail whose delivery is finished (sent, or failed for good) and older than the cut-off;
 * pending mail is never pruned. The demo mail catcher's copies go by the same rule.
 */
export async function pruneFinishedMail(db: Knex, cutoff: Date): Promise<number> {
  const outbox = await db.raw(
    `DELETE FROM outbox WHERE status IN ('sent', 'failed') AND coalesce(sent_at, created_at) < ?`,
    [cutoff],
  );
  const caught = await db.raw(`DELETE FROM caught_mail WHERE received_at < ?`, [cutoff]);
  return count(outbox) + count(caught);
}

/** Alerts older than the cut-off that nobody has marked read. */
export async function pruneUnreadAlerts(db: Knex, cutoff: Date): Promise<number> {
  return count(
    await db.raw(
      `DELETE FROM alerts a WHERE a.created_at < ? AND NOT EXISTS (SELECT 1 FROM alert_reads r WHERE r.alert_id = a.id)`,
      [cutoff],
    ),
  );
}

export async function deleteSessionsOf(db: Knex, userId: number): Promise<number> {
  return count(await db.raw(`DELETE FROM session WHERE sess->'passport'->>'user' = ?`, [String(userId)]));
}

export async function deleteSubscriptionsOf(db: Knex, userId: number): Promise<number> {
  return count(await db.raw(`DELETE FROM subscriptions WHERE user_id = ?`, [userId]));
}

/**
 * Puts a pseudonym in place of the person's address wherever history keeps it: the actor
 * of their audit entries, any JSON string in an entry's before/after equal to the address,
 * the name on entries about them, and the uploader/author columns. Returns the audit
 * entries touched.
 */
export async function pseudonymise(db: Knex, p: { userId: number; email: string; pseudonym: string }): Promise<number> {
  const { userId, email, pseudonym } = p;
  const asActor = await db.raw(
    `UPDATE audit_log SET actor_email = :pseudonym WHERE actor_id = :userId OR lower(actor_email) = lower(:email)`,
    { userId, email, pseudonym },
  );
  // to_json(text)::text is the address as a JSON string, quotes included: only whole values match.
  const replaceIn = (col: string) =>
    `CASE WHEN ${col} IS NULL THEN NULL
          ELSE replace(${col}::text, to_json(:email::text)::text, to_json(:pseudonym::text)::text)::jsonb END`;
  const unname = (col: string) =>
    `CASE WHEN jsonb_typeof(${col}) = 'object' AND (${col} -> 'name') IS NOT NULL THEN jsonb_set(${col}, '{name}', '""') ELSE ${col} END`;
  const inJson = await db.raw(
    `UPDATE audit_log
        SET before = ${replaceIn('before')}, after = ${replaceIn('after')}
      WHERE position(to_json(:email::text)::text IN coalesce(before::text, '') || coalesce(after::text, '')) > 0`,
    { email, pseudonym },
  );
  await db.raw(
    `UPDATE audit_log SET before = ${unname('before')}, after = ${unname('after')}
      WHERE target_type = 'user' AND target_id = :id`,
    { id: String(userId) },
  );
  await db.raw(
    `UPDATE uploads SET user_email = :pseudonym WHERE user_id = :userId OR lower(user_email) = lower(:email)`,
    {
      userId,
      email,
      pseudonym,
    },
  );
  await db.raw(
    `UPDATE run_notes SET author_email = :pseudonym WHERE author_id = :userId OR lower(author_email) = lower(:email)`,
    {
      userId,
      email,
      pseudonym,
    },
  );
  await db.raw(`DELETE FROM caught_mail WHERE lower(:email) = ANY(SELECT lower(x) FROM unnest(envelope_to) x)`, {
    email,
  });
  return count(asActor) + count(inJson);
}
