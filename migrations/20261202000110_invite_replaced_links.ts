import type { Knex } from 'knex';

// Links of an invitation that was sent again, so an old e-mail's link can say it was replaced.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('invites', (t) => {
    t.specificType('replaced_token_hashes', 'text[]').notNullable().defaultTo('{}');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('invites', (t) => {
    t.dropColumn('replaced_token_hashes');
  });
}
