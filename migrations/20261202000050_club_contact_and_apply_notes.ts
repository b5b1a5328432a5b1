import type { Knex } from 'knex';

// A club's contact address (Reply-To of its e-mails), the fee and typical wait its public
// application form states, and the display name an outbox message is sent under.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clubs', (t) => {
    t.string('contact_email', 254).nullable();
    t.string('fee_note', 200).nullable();
    t.string('typical_wait', 200).nullable();
  });
  await knex.schema.alterTable('mail_outbox', (t) => {
    t.string('from_name', 200).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('mail_outbox', (t) => {
    t.dropColumn('from_name');
  });
  await knex.schema.alterTable('clubs', (t) => {
    t.dropColumn('typical_wait');
    t.dropColumn('fee_note');
    t.dropColumn('contact_email');
  });
}
