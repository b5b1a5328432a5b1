import type { Knex } from 'knex';

// First run: a club's first coordinator signs up on a public page and proves the address with an e-mailed
// link (only the token's SHA-256 kept, an expiry, used once). The club keeps the units its new sites start
// with, and whether its coordinators hid the first-run checklist.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('club_signups', (t) => {
    t.increments('id');
    t.string('email', 254).notNullable();
    t.string('name', 200).notNullable();
    // A bcrypt hash of the chosen password; used only when the address has no account yet.
    t.string('password_hash', 100).notNullable();
    t.string('club_name', 200).notNullable();
    t.string('time_zone', 64).notNullable();
    t.string('currency', 3).notNullable();
    t.string('units', 6).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true }).nullable();
    t.integer('club_id').nullable().references('clubs.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`alter table club_signups add constraint club_signups_units_check check (units in ('metric', 'us'))`);
  await knex.schema.alterTable('clubs', (t) => {
    t.string('units', 6).notNullable().defaultTo('metric');
    t.boolean('checklist_hidden').notNullable().defaultTo(false);
  });
  await knex.raw(`alter table clubs add constraint clubs_units_check check (units in ('metric', 'us'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table clubs drop constraint if exists clubs_units_check');
  await knex.schema.alterTable('clubs', (t) => {
    t.dropColumn('units');
    t.dropColumn('checklist_hidden');
  });
  await knex.schema.dropTableIfExists('club_signups');
}
