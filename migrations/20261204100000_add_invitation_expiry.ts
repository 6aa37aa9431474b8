import type { Knex } from 'knex';

/**
 * Invitations expire. Every invitation still pending (sent, never used to sign in) gets 14
 * days from now, the default of the `invitationDays` setting. Rows that were never sent as
 * invitations (the first admin, the demo accounts) keep no expiry. Google subjects already
 * stored stay as they are: from now on they pin the account to that identity.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.timestamp('invitation_expires_at', { useTz: true }).nullable();
  });
  await knex.raw(
    `UPDATE users SET invitation_expires_at = now() + interval '14 days'
      WHERE invited_at IS NOT NULL AND last_sign_in_at IS NULL`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('invitation_expires_at');
  });
}
