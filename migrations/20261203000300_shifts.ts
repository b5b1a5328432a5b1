import type { Knex } from 'knex';

// Shifts: open tasks grouped for one date and time window at a site, with places volunteers take
// (from the board or from an e-mailed link), reminders, done with a note and photo, and hours per
// season against the club's ask. Calendar feeds are secret addresses whose hashes are kept.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clubs', (t) => {
    // Hours each volunteer is asked to give per season; null when the club asks for none.
    t.decimal('volunteer_hours_required', 5, 1).nullable();
  });
  await knex.schema.alterTable('mail_outbox', (t) => {
    // Files sent with a message (a shift's .ics): [{ filename, contentType, content }].
    t.jsonb('attachments').nullable();
  });

  await knex.schema.createTable('shifts', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    t.string('title', 160).notNullable();
    t.string('kind', 12).notNullable();
    // The site's calendar date and wall-clock times, and the instants they are in its zone.
    t.date('on_date').notNullable();
    t.string('start_time', 5).notNullable();
    t.string('end_time', 5).notNullable();
    t.timestamp('starts_at', { useTz: true }).notNullable();
    t.timestamp('ends_at', { useTz: true }).notNullable();
    t.integer('capacity').notNullable();
    t.decimal('est_hours', 4, 2).notNullable();
    t.text('instructions').notNullable().defaultTo('');
    t.timestamp('called_off_at', { useTz: true }).nullable();
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['club_id', 'on_date']);
    t.index(['site_id', 'on_date']);
  });
  await knex.raw(`alter table shifts
    add constraint shifts_kind_check check (kind in ('water', 'weed', 'thin', 'side_dress', 'mulch', 'scout', 'harvest', 'other', 'mixed')),
    add constraint shifts_capacity_check check (capacity between 1 and 50),
    add constraint shifts_time_check check (starts_at < ends_at)`);

  // A task is in at most one shift.
  await knex.schema.createTable('shift_tasks', (t) => {
    t.integer('shift_id').notNullable().references('shifts.id').onDelete('CASCADE');
    t.bigInteger('task_id').notNullable().references('tasks.id').onDelete('CASCADE').unique();
    t.primary(['shift_id', 'task_id']);
  });

  await knex.schema.createTable('shift_claims', (t) => {
    t.increments('id');
    t.integer('shift_id').notNullable().references('shifts.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('status', 10).notNullable().defaultTo('taken');
    t.string('via', 10).notNullable();
    t.timestamp('taken_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('released_at', { useTz: true }).nullable();
    t.timestamp('done_at', { useTz: true }).nullable();
    t.timestamp('reminded_at', { useTz: true }).nullable();
    t.decimal('hours', 4, 2).nullable();
    t.text('note').notNullable().defaultTo('');
    t.string('photo_path', 200).nullable();
    t.index(['user_id', 'status']);
  });
  await knex.raw(`alter table shift_claims
    add constraint shift_claims_status_check check (status in ('taken', 'done', 'released', 'missed')),
    add constraint shift_claims_via_check check (via in ('link', 'board'))`);
  // One live place per person per shift (a released place can be taken again).
  await knex.raw(`create unique index shift_claims_one_per_person on shift_claims (shift_id, user_id) where status <> 'released'`);

  // E-mailed links: one volunteer, one shift, one purpose; only the hash is kept.
  await knex.schema.createTable('shift_links', (t) => {
    t.increments('id');
    t.integer('shift_id').notNullable().references('shifts.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.integer('claim_id').nullable().references('shift_claims.id').onDelete('CASCADE');
    t.string('purpose', 8).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`alter table shift_links add constraint shift_links_purpose_check check (purpose in ('claim', 'release', 'done'))`);

  // A volunteer's e-mail choices about shifts, per club. digest_day: 0 Sunday … 6 Saturday, null for none.
  await knex.schema.createTable('volunteer_settings', (t) => {
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.smallint('digest_day').nullable().defaultTo(1);
    t.boolean('help_mail').notNullable().defaultTo(true);
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['club_id', 'user_id']);
  });

  // One digest per person per club and week, whichever server sends it.
  await knex.schema.createTable('shift_digests', (t) => {
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.date('week_start').notNullable();
    t.timestamp('sent_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['club_id', 'user_id', 'week_start']);
  });

  // Calendar feeds at secret addresses: a person's own shifts, or a coordinator's feed of the club's.
  await knex.schema.createTable('calendar_feeds', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('kind', 8).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['club_id', 'user_id', 'kind']);
  });
  await knex.raw(`alter table calendar_feeds add constraint calendar_feeds_kind_check check (kind in ('personal', 'club'))`);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['calendar_feeds', 'shift_digests', 'volunteer_settings', 'shift_links', 'shift_claims', 'shift_tasks', 'shifts']) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.schema.alterTable('mail_outbox', (t) => t.dropColumn('attachments'));
  await knex.schema.alterTable('clubs', (t) => t.dropColumn('volunteer_hours_required'));
}
