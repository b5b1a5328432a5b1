import type { Knex } from 'knex';

// Counters of failed sign-ins per account and per client address, shared by every server.
// The layout is the one rate-limiter-flexible's PostgreSQL store reads and writes
// (key, points, expire in epoch milliseconds); it is created here so a fresh database and a
// rollback behave the same, as with the session table.
//
// Invitations can be cancelled by a coordinator: the link then answers that it is no longer valid.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sign_in_limits', (t) => {
    t.string('key', 255).primary();
    t.integer('points').notNullable().defaultTo(0);
    t.bigInteger('expire');
  });
  await knex.schema.alterTable('invites', (t) => {
    t.timestamp('cancelled_at', { useTz: true }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('invites', (t) => {
    t.dropColumn('cancelled_at');
  });
  await knex.schema.dropTable('sign_in_limits');
}
