import type { Knex } from 'knex';

// People, clubs and per-club roles, the links that invite people and reset passwords,
// and the session store's table (the schema connect-pg-simple documents).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id');
    t.string('email', 254).notNullable();
    t.string('name', 120).notNullable();
    t.string('password_hash', 100).nullable();
    t.timestamps(true, true);
  });
  await knex.raw('create unique index users_email_unique on users (lower(email))');

  await knex.schema.createTable('clubs', (t) => {
    t.increments('id');
    t.string('name', 160).notNullable();
    t.string('slug', 80).notNullable().unique();
    t.timestamps(true, true);
  });

  await knex.schema.createTable('memberships', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('role', 20).notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['club_id', 'user_id', 'role']);
    t.index(['user_id']);
  });
  await knex.raw(
    "alter table memberships add constraint memberships_role_check check (role in ('coordinator','plot_holder','volunteer'))",
  );

  await knex.schema.createTable('invites', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.string('name', 120).notNullable();
    t.specificType('roles', 'text[]').notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('accepted_at', { useTz: true }).nullable();
    t.integer('invited_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.integer('accepted_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['club_id']);
  });

  await knex.schema.createTable('password_resets', (t) => {
    t.increments('id');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.raw(`
    create table "session" (
      "sid" varchar not null collate "default" primary key,
      "sess" json not null,
      "expire" timestamp(6) not null
    );
    create index "IDX_session_expire" on "session" ("expire");
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('session');
  await knex.schema.dropTable('password_resets');
  await knex.schema.dropTable('invites');
  await knex.schema.dropTable('memberships');
  await knex.schema.dropTable('clubs');
  await knex.schema.dropTable('users');
}
