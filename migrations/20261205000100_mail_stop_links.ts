import type { Knex } from 'knex';

// Stop links of optional mail (List-Unsubscribe, RFC 2369 / RFC 8058): a random token per person, club
// and kind of mail, only its SHA-256 kept; using one turns that kind of mail off for that person in that club.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_stop_links', (t) => {
    t.increments('id');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.string('kind', 20).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('used_at', { useTz: true }).nullable();
    t.index(['user_id', 'club_id', 'kind']);
  });
  await knex.raw(`alter table mail_stop_links add constraint mail_stop_links_kind_check
    check (kind in ('club_news', 'shift_digest', 'shift_reminder', 'shift_help'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('mail_stop_links');
}
