import type { Knex } from 'knex';

/** Invitations on users, the audit log, and the demo mail catcher's mailbox. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.integer('invited_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('invited_at', { useTz: true }).nullable();
  });

  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary();
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.integer('actor_id').nullable().references('users.id').onDelete('SET NULL');
    t.text('actor_email').nullable();
    t.text('action').notNullable();
    t.text('target_type').notNullable();
    t.text('target_id').nullable();
    t.jsonb('before').nullable();
    t.jsonb('after').nullable();
    t.index(['at']);
    t.index(['action', 'at']);
  });

  await knex.schema.createTable('caught_mail', (t) => {
    t.bigIncrements('id').primary();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('envelope_from').nullable();
    t.specificType('envelope_to', 'text[]').notNullable();
    t.text('subject').notNullable().defaultTo('');
    t.text('text_body').notNullable().defaultTo('');
    t.text('html_body').nullable();
    t.jsonb('attachments').notNullable().defaultTo('[]');
    t.text('message_id').nullable();
    t.integer('size_bytes').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('caught_mail');
  await knex.schema.dropTableIfExists('audit_log');
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('invited_at');
    t.dropColumn('invited_by');
  });
}
