import type { Knex } from 'knex';

// Every e-mail is first written here, in the same transaction as the change that causes it,
// and a job sends it with retries: a mail server that is down delays mail but loses none.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_outbox', (t) => {
    t.bigIncrements('id');
    // Null for account mail (password resets), which no club's coordinators see.
    t.integer('club_id').nullable().references('clubs.id').onDelete('CASCADE');
    t.string('kind', 40).notNullable();
    // A club message's copies point at it, so its sent list counts what was really delivered.
    t.integer('mailing_id').nullable().references('mailings.id').onDelete('SET NULL');
    t.string('to_address', 254).notNullable();
    t.string('subject', 300).notNullable();
    t.text('html').notNullable();
    t.text('text').notNullable();
    t.jsonb('headers').notNullable().defaultTo('{}');
    t.string('status', 10).notNullable().defaultTo('waiting');
    t.integer('attempts').notNullable().defaultTo(0);
    t.text('last_error').nullable();
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('sent_at', { useTz: true }).nullable();
  });
  await knex.raw(`alter table mail_outbox add constraint mail_outbox_status_check check (status in ('waiting', 'sent', 'failed'))`);
  // The sender looks only at waiting rows that are due.
  await knex.raw(`create index mail_outbox_due on mail_outbox (next_attempt_at, id) where status = 'waiting'`);
  // The coordinator's list: one club's mail by status, newest first.
  await knex.raw(`create index mail_outbox_club on mail_outbox (club_id, status, created_at desc)`);
  await knex.raw(`create index mail_outbox_mailing on mail_outbox (mailing_id) where mailing_id is not null`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_outbox');
}
