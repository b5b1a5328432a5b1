import type { Knex } from 'knex';

// The season's tasks: generated from plantings, the crop notes and the weather log (the generator owns
// a generated task until it is done), and tasks coordinators add, once or as a repeating series. A
// holder away for a while hands a plot's tasks of some kinds to the volunteers for those days. A run
// of the generator over a site records its progress for the coordinator's progress bar.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clubs', (t) => {
    // How much faster raised beds and containers dry than open ground: multipliers of the water need.
    t.decimal('raised_bed_water_factor', 4, 2).notNullable().defaultTo(1.2);
    t.decimal('container_water_factor', 4, 2).notNullable().defaultTo(1.5);
  });
  await knex.raw(`alter table clubs
    add constraint clubs_raised_bed_water_factor_check check (raised_bed_water_factor between 0.5 and 3),
    add constraint clubs_container_water_factor_check check (container_water_factor between 0.5 and 3)`);

  await knex.schema.createTable('task_series', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    t.integer('plot_id').nullable().references('plots.id').onDelete('CASCADE');
    t.string('kind', 12).notNullable();
    t.text('title').notNullable();
    t.text('details').notNullable().defaultTo('');
    t.date('starts_on').notNullable();
    t.date('ends_on').notNullable();
    t.smallint('every_days').notNullable();
    t.smallint('window_days').notNullable();
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('task_handovers', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.date('from_on').notNullable();
    t.date('to_on').notNullable();
    t.specificType('kinds', 'text[]').notNullable();
    t.text('note').notNullable().defaultTo('');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('cancelled_at', { useTz: true }).nullable();
    t.index(['plot_id']);
  });
  await knex.raw('alter table task_handovers add constraint task_handovers_dates_check check (to_on >= from_on)');

  await knex.schema.createTable('tasks', (t) => {
    t.bigIncrements('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    t.integer('plot_id').nullable().references('plots.id').onDelete('CASCADE');
    // A done task outlives its planting (the history stays); an open one goes with it.
    t.integer('planting_id').nullable().references('plantings.id').onDelete('SET NULL');
    t.integer('series_id').nullable().references('task_series.id').onDelete('SET NULL');
    t.string('origin', 12).notNullable();
    // The generator's identity of a task within its planting or series, e.g. `weed:2026-05-04`.
    t.string('gen_key', 60).nullable();
    t.string('kind', 12).notNullable();
    t.text('title').notNullable();
    t.text('details').notNullable().defaultTo('');
    t.text('source').notNullable().defaultTo('');
    t.text('caution').nullable();
    t.text('crop_name').nullable();
    t.date('due_on').notNullable();
    t.date('window_from').notNullable();
    t.date('window_to').notNullable();
    t.decimal('amount_mm', 7, 1).nullable();
    t.decimal('amount_l', 10, 1).nullable();
    t.string('status', 8).notNullable().defaultTo('open');
    t.boolean('for_volunteers').notNullable().defaultTo(false);
    t.date('done_on').nullable();
    t.integer('done_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.text('done_note').notNullable().defaultTo('');
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['site_id', 'due_on']);
    t.index(['plot_id', 'due_on']);
    t.index(['club_id', 'status', 'for_volunteers']);
  });
  await knex.raw(`alter table tasks
    add constraint tasks_kind_check check (kind in ('water', 'weed', 'thin', 'side_dress', 'mulch', 'scout', 'harvest', 'other')),
    add constraint tasks_status_check check (status in ('open', 'done', 'skipped')),
    add constraint tasks_origin_check check (origin in ('generated', 'coordinator')),
    add constraint tasks_window_check check (window_from <= due_on and due_on <= window_to),
    add constraint tasks_generated_key_check check (origin <> 'generated' or gen_key is not null)`);
  await knex.raw('create unique index tasks_planting_key_unique on tasks (planting_id, gen_key) where planting_id is not null and gen_key is not null');
  await knex.raw('create unique index tasks_series_key_unique on tasks (series_id, gen_key) where series_id is not null and gen_key is not null');
  await knex.raw('create index tasks_planting_idx on tasks (planting_id) where planting_id is not null');

  await knex.schema.createTable('task_runs', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    t.integer('requested_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.string('status', 8).notNullable().defaultTo('queued');
    t.integer('total').notNullable().defaultTo(0);
    t.integer('done').notNullable().defaultTo(0);
    t.integer('created').notNullable().defaultTo(0);
    t.integer('updated').notNullable().defaultTo(0);
    t.integer('removed').notNullable().defaultTo(0);
    t.text('error').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('finished_at', { useTz: true }).nullable();
    t.index(['site_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('task_runs');
  await knex.schema.dropTable('tasks');
  await knex.schema.dropTable('task_handovers');
  await knex.schema.dropTable('task_series');
  await knex.raw('alter table clubs drop constraint clubs_raised_bed_water_factor_check, drop constraint clubs_container_water_factor_check');
  await knex.schema.alterTable('clubs', (t) => {
    t.dropColumn('raised_bed_water_factor');
    t.dropColumn('container_water_factor');
  });
}
