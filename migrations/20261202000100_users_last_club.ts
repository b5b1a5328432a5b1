import type { Knex } from 'knex';

// The club a person last opened, so signing in on any device brings them back to it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.integer('last_club_id').nullable().references('clubs.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('last_club_id');
  });
}
