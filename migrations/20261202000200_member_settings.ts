import type { Knex } from 'knex';

// What a club decides about one member beyond their roles; today whether they pay the concession rate.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('member_settings', (t) => {
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.boolean('has_concession').notNullable().defaultTo(false);
    t.integer('updated_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['club_id', 'user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('member_settings');
}
