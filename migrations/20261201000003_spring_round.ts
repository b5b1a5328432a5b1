import type { Knex } from 'knex';

// The spring round: the waitlist, seasons, renewals of last season's holders, offers of free
// plots, allocations (one holder per plot per season), fees and payments, and the choices a
// person makes about optional e-mail.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clubs', (t) => {
    t.string('currency', 3).notNullable().defaultTo('GBP');
    t.integer('offer_days').notNullable().defaultTo(7);
    t.integer('renewal_days').notNullable().defaultTo(14);
    t.string('declined_offer_policy', 12).notNullable().defaultTo('end_of_list');
    t.boolean('allow_multiple_offers').notNullable().defaultTo(false);
  });
  await knex.raw(`alter table clubs
    add constraint clubs_declined_policy_check check (declined_offer_policy in ('end_of_list', 'remove')),
    add constraint clubs_offer_days_check check (offer_days between 1 and 60),
    add constraint clubs_renewal_days_check check (renewal_days between 1 and 90)`);

  await knex.schema.createTable('applications', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.string('name', 120).notNullable();
    t.string('email', 254).notNullable();
    t.string('phone', 40).notNullable().defaultTo('');
    t.string('preferred_size', 10).notNullable().defaultTo('any');
    t.boolean('needs_accessible').notNullable().defaultTo(false);
    t.boolean('needs_raised').notNullable().defaultTo(false);
    t.integer('preferred_site_id').nullable().references('sites.id').onDelete('SET NULL');
    t.text('notes').notNullable().defaultTo('');
    t.string('status', 12).notNullable().defaultTo('waiting');
    t.string('removed_reason', 200).nullable();
    // When they joined the queue; the queue is ordered by queue_at, which starts as applied_at
    // and moves only by a recorded reorder or the club's declined-offer policy.
    t.timestamp('applied_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('queue_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamps(true, true);
    t.index(['club_id', 'status', 'queue_at']);
  });
  await knex.raw(`alter table applications
    add constraint applications_status_check check (status in ('waiting', 'offered', 'allocated', 'removed', 'withdrawn')),
    add constraint applications_size_check check (preferred_size in ('small', 'medium', 'large', 'any'))`);
  await knex.raw(
    "create unique index applications_live_email_unique on applications (club_id, lower(email)) where status in ('waiting', 'offered')",
  );

  await knex.schema.createTable('waitlist_moves', (t) => {
    t.increments('id');
    t.integer('application_id').notNullable().references('applications.id').onDelete('CASCADE');
    t.integer('from_position').nullable();
    t.integer('to_position').nullable();
    t.string('kind', 20).notNullable(); // reordered, declined_moved, removed, lapsed_moved
    t.string('reason', 300).notNullable();
    t.integer('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('seasons', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('year').notNullable();
    t.timestamp('renewal_deadline', { useTz: true }).nullable();
    t.integer('opened_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['club_id', 'year']);
  });

  await knex.schema.createTable('allocations', (t) => {
    t.increments('id');
    t.integer('season_id').notNullable().references('seasons.id').onDelete('CASCADE');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('source', 10).notNullable();
    t.string('status', 10).notNullable().defaultTo('active');
    t.timestamp('released_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id']);
  });
  await knex.raw(`alter table allocations
    add constraint allocations_source_check check (source in ('renewal', 'offer', 'manual', 'import')),
    add constraint allocations_status_check check (status in ('active', 'released'))`);
  // One holder per plot per season, guaranteed by the database.
  await knex.raw("create unique index allocations_one_holder on allocations (season_id, plot_id) where status = 'active'");

  await knex.schema.createTable('renewals', (t) => {
    t.increments('id');
    t.integer('season_id').notNullable().references('seasons.id').onDelete('CASCADE');
    t.integer('previous_allocation_id').notNullable().references('allocations.id').onDelete('CASCADE');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('deadline', { useTz: true }).notNullable();
    t.string('status', 10).notNullable().defaultTo('pending');
    t.timestamp('answered_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['season_id', 'plot_id']);
    t.index(['status', 'deadline']);
  });
  await knex.raw(
    "alter table renewals add constraint renewals_status_check check (status in ('pending', 'kept', 'released', 'lapsed'))",
  );

  await knex.schema.createTable('offers', (t) => {
    t.increments('id');
    t.integer('season_id').notNullable().references('seasons.id').onDelete('CASCADE');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('application_id').notNullable().references('applications.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('deadline', { useTz: true }).notNullable();
    t.string('status', 10).notNullable().defaultTo('pending');
    t.boolean('is_exclusive').notNullable().defaultTo(true);
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('answered_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['status', 'deadline']);
  });
  await knex.raw(
    "alter table offers add constraint offers_status_check check (status in ('pending', 'accepted', 'declined', 'lapsed', 'withdrawn'))",
  );
  // A plot has at most one open offer; a person at most one, unless the club allows more.
  await knex.raw("create unique index offers_one_per_plot on offers (season_id, plot_id) where status = 'pending'");
  await knex.raw(
    "create unique index offers_one_per_person on offers (application_id) where status = 'pending' and is_exclusive",
  );

  await knex.schema.createTable('fee_schedules', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().unique().references('clubs.id').onDelete('CASCADE');
    t.string('basis', 6).notNullable().defaultTo('kind');
    t.string('area_unit', 4).notNullable().defaultTo('m2');
    t.integer('rate_minor_per_area').notNullable().defaultTo(0);
    t.integer('price_in_ground_minor').notNullable().defaultTo(0);
    t.integer('price_raised_bed_minor').notNullable().defaultTo(0);
    t.integer('price_container_minor').notNullable().defaultTo(0);
    t.integer('price_shared_bed_minor').notNullable().defaultTo(0);
    t.integer('concession_percent').notNullable().defaultTo(0);
    t.integer('deposit_minor').notNullable().defaultTo(0);
    t.timestamps(true, true);
  });
  await knex.raw(`alter table fee_schedules
    add constraint fee_schedules_basis_check check (basis in ('area', 'kind')),
    add constraint fee_schedules_area_unit_check check (area_unit in ('m2', 'ft2')),
    add constraint fee_schedules_amounts_check check (rate_minor_per_area >= 0 and price_in_ground_minor >= 0
      and price_raised_bed_minor >= 0 and price_container_minor >= 0 and price_shared_bed_minor >= 0 and deposit_minor >= 0),
    add constraint fee_schedules_concession_check check (concession_percent between 0 and 100)`);

  await knex.schema.createTable('fees', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('season_id').notNullable().references('seasons.id').onDelete('CASCADE');
    t.integer('allocation_id').notNullable().unique().references('allocations.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.string('description', 200).notNullable();
    t.integer('plot_fee_minor').notNullable();
    t.integer('deposit_minor').notNullable().defaultTo(0);
    t.boolean('is_concession').notNullable().defaultTo(false);
    t.string('currency', 3).notNullable();
    t.date('due_on').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['club_id', 'season_id']);
  });
  await knex.raw('alter table fees add constraint fees_amounts_check check (plot_fee_minor >= 0 and deposit_minor >= 0)');

  await knex.schema.createTable('payments', (t) => {
    t.increments('id');
    t.integer('fee_id').notNullable().references('fees.id').onDelete('CASCADE');
    t.string('kind', 8).notNullable().defaultTo('payment');
    t.integer('amount_minor').notNullable();
    t.string('method', 14).notNullable();
    t.date('paid_on').notNullable();
    t.string('note', 300).notNullable().defaultTo('');
    t.integer('recorded_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['fee_id']);
  });
  await knex.raw(`alter table payments
    add constraint payments_kind_check check (kind in ('payment', 'refund')),
    add constraint payments_method_check check (method in ('cash', 'cheque', 'bank_transfer', 'card')),
    add constraint payments_amount_check check (amount_minor > 0)`);

  await knex.schema.createTable('mail_preferences', (t) => {
    t.increments('id');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.string('topic', 30).notNullable();
    t.boolean('is_subscribed').notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['user_id', 'club_id', 'topic']);
  });

  await knex.schema.createTable('mailings', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.string('subject', 200).notNullable();
    t.text('body').notNullable();
    t.jsonb('audience').notNullable();
    t.integer('recipient_count').notNullable().defaultTo(0);
    t.integer('sent_count').notNullable().defaultTo(0);
    t.integer('sent_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['mailings', 'mail_preferences', 'payments', 'fees', 'fee_schedules', 'offers', 'renewals', 'allocations', 'seasons', 'waitlist_moves', 'applications']) {
    await knex.schema.dropTable(table);
  }
  await knex.raw(`alter table clubs
    drop constraint clubs_declined_policy_check, drop constraint clubs_offer_days_check, drop constraint clubs_renewal_days_check`);
  await knex.schema.alterTable('clubs', (t) => {
    t.dropColumns('currency', 'offer_days', 'renewal_days', 'declined_offer_policy', 'allow_multiple_offers');
  });
}
