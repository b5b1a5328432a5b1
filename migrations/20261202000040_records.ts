import type { Knex } from 'knex';

// Money and records: sites are archived instead of deleted while they carry history, a club has
// its own time zone (first taken from its first site), and creating requests can carry an
// Idempotency-Key whose first answer is kept and replayed.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (t) => {
    t.timestamp('archived_at', { useTz: true }).nullable();
  });

  await knex.schema.alterTable('clubs', (t) => {
    t.string('time_zone', 64).nullable();
  });
  await knex.raw(`update clubs c set time_zone = (
    select s.time_zone from sites s where s.club_id = c.id order by s.id limit 1
  )`);
  await knex.raw("update clubs set time_zone = 'UTC' where time_zone is null");
  await knex.raw("alter table clubs alter column time_zone set not null, alter column time_zone set default 'UTC'");

  await knex.schema.createTable('idempotency_keys', (t) => {
    t.increments('id');
    // Who sent it: "user:<id>" for a signed-in person; the key means something only to its sender.
    t.string('scope', 40).notNullable();
    t.integer('club_id').nullable().references('clubs.id').onDelete('CASCADE');
    t.string('route', 300).notNullable();
    t.string('key', 200).notNullable();
    t.string('request_hash', 64).notNullable();
    // Null while the first request is still being handled.
    t.integer('response_status').nullable();
    t.string('response_type', 100).nullable();
    t.text('response_body').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['scope', 'route', 'key']);
    t.index(['created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('idempotency_keys');
  await knex.schema.alterTable('clubs', (t) => {
    t.dropColumn('time_zone');
  });
  await knex.schema.alterTable('sites', (t) => {
    t.dropColumn('archived_at');
  });
}
