import type { Knex } from 'knex';

// Counts of requests per client address for the rate-limited routes (password resets, invitation
// and e-mailed links, the public application form), shared by every server on the database. The
// layout is the one rate-limiter-flexible's PostgreSQL store reads and writes (key, points,
// expire in epoch milliseconds), as for sign_in_limits; the key is the limiter's name and a hash
// of the address.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limits', (t) => {
    t.string('key', 255).primary();
    t.integer('points').notNullable().defaultTo(0);
    t.bigInteger('expire');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limits');
}
