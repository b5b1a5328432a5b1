import type { Knex } from 'knex';

// A club's sites and the plots drawn on them (metres, north-west corner, rotation 0/90),
// with a history of every change to a plot.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sites', (t) => {
    t.increments('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.text('address').notNullable().defaultTo('');
    t.decimal('latitude', 8, 5).notNullable();
    t.decimal('longitude', 8, 5).notNullable();
    t.string('time_zone', 64).notNullable();
    t.string('units', 8).notNullable().defaultTo('metric');
    t.decimal('path_width_m', 6, 3).notNullable().defaultTo(0.9);
    t.decimal('grid_m', 6, 3).notNullable().defaultTo(0.5);
    t.decimal('width_m', 8, 3).notNullable().defaultTo(40);
    t.decimal('length_m', 8, 3).notNullable().defaultTo(30);
    t.string('last_spring_frost', 5).nullable(); // typical date, MM-DD
    t.string('first_autumn_frost', 5).nullable(); // typical date, MM-DD
    t.text('soil_notes').notNullable().defaultTo('');
    t.string('background_file', 80).nullable();
    t.string('background_mime', 40).nullable();
    t.integer('background_width_px').nullable();
    t.integer('background_height_px').nullable();
    t.decimal('background_m_per_px', 12, 6).nullable();
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['club_id', 'name']);
  });
  await knex.raw(`alter table sites
    add constraint sites_units_check check (units in ('metric', 'us')),
    add constraint sites_latitude_check check (latitude between -90 and 90),
    add constraint sites_longitude_check check (longitude between -180 and 180),
    add constraint sites_path_width_check check (path_width_m >= 0),
    add constraint sites_grid_check check (grid_m >= 0),
    add constraint sites_size_check check (width_m > 0 and length_m > 0)`);

  await knex.schema.createTable('plots', (t) => {
    t.increments('id');
    t.integer('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    t.string('label', 20).notNullable();
    t.decimal('x_m', 8, 3).notNullable();
    t.decimal('y_m', 8, 3).notNullable();
    t.decimal('width_m', 8, 3).notNullable();
    t.decimal('length_m', 8, 3).notNullable();
    t.smallint('rotation').notNullable().defaultTo(0);
    t.string('kind', 20).notNullable().defaultTo('in_ground');
    t.decimal('soil_depth_m', 5, 2).nullable();
    t.decimal('soil_ph', 3, 1).nullable();
    t.date('soil_tested_on').nullable();
    t.string('sun', 8).notNullable().defaultTo('full');
    t.boolean('is_accessible').notNullable().defaultTo(false);
    t.boolean('has_water_tap').notNullable().defaultTo(false);
    t.text('notes').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('deleted_at', { useTz: true }).nullable();
    t.timestamps(true, true);
    t.index(['site_id']);
  });
  await knex.raw(`alter table plots
    add constraint plots_rotation_check check (rotation in (0, 90)),
    add constraint plots_kind_check check (kind in ('in_ground', 'raised_bed', 'container', 'shared_bed')),
    add constraint plots_sun_check check (sun in ('full', 'part', 'shade')),
    add constraint plots_size_check check (width_m > 0 and length_m > 0),
    add constraint plots_position_check check (x_m >= 0 and y_m >= 0),
    add constraint plots_ph_check check (soil_ph is null or soil_ph between 3 and 10)`);
  // A label names one live plot on a site; deleted plots keep theirs for the history.
  await knex.raw('create unique index plots_site_label_unique on plots (site_id, lower(label)) where deleted_at is null');

  await knex.schema.createTable('plot_events', (t) => {
    t.increments('id');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.string('kind', 30).notNullable();
    t.jsonb('details').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['plot_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('plot_events');
  await knex.schema.dropTable('plots');
  await knex.schema.dropTable('sites');
}
