import type { Knex } from 'knex';

// The crop notes (reference crops from shared/crops, loaded at start; club crops and overrides) and
// the plot book (plantings on a plot or part of it, harvests, observations with photos).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clubs', (t) => {
    t.smallint('rotation_gap_years').notNullable().defaultTo(3);
    t.boolean('shares_plot_books').notNullable().defaultTo(false);
  });
  await knex.raw('alter table clubs add constraint clubs_rotation_gap_check check (rotation_gap_years between 1 and 10)');
  await knex.schema.alterTable('sites', (t) => {
    // Twelve monthly soil temperatures at sowing depth, °C, January first; null until the club fills them in.
    t.jsonb('soil_temps_c').nullable();
  });

  await knex.schema.createTable('crops', (t) => {
    t.increments('id');
    // Null for the reference catalogue every club shares; a club's own crops carry its id.
    t.integer('club_id').nullable().references('clubs.id').onDelete('CASCADE');
    t.string('slug', 60).notNullable();
    t.string('common_name', 80).notNullable();
    t.string('family', 60).notNullable();
    t.string('kind', 12).notNullable();
    // The whole crop as in shared/crops/types.ts, every value with its source.
    t.jsonb('data').notNullable();
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
  });
  await knex.raw('create unique index crops_slug_unique on crops (coalesce(club_id, 0), slug)');
  await knex.raw(`alter table crops add constraint crops_kind_check
    check (kind in ('root', 'leaf', 'fruiting', 'legume', 'allium', 'brassica', 'herb', 'flower'))`);

  // A club's own value for one field of a reference crop, with its source; the reference row stays as it is.
  await knex.schema.createTable('crop_overrides', (t) => {
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('crop_id').notNullable().references('crops.id').onDelete('CASCADE');
    t.string('field', 40).notNullable();
    t.jsonb('value').notNullable();
    t.integer('updated_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['club_id', 'crop_id', 'field']);
  });

  await knex.schema.createTable('crop_relations', (t) => {
    t.increments('id');
    t.integer('club_id').nullable().references('clubs.id').onDelete('CASCADE');
    t.integer('crop_a_id').notNullable().references('crops.id').onDelete('CASCADE');
    t.integer('crop_b_id').notNullable().references('crops.id').onDelete('CASCADE');
    t.string('effect', 14).notNullable();
    t.decimal('distance_m', 5, 2).nullable(); // null: within the same plot only
    t.string('severity', 6).nullable();
    t.text('reason').notNullable();
    t.string('evidence', 16).notNullable();
    t.string('source', 60).notNullable();
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
  });
  await knex.raw('create unique index crop_relations_pair_unique on crop_relations (coalesce(club_id, 0), least(crop_a_id, crop_b_id), greatest(crop_a_id, crop_b_id))');
  await knex.raw(`alter table crop_relations
    add constraint crop_relations_effect_check check (effect in ('beneficial', 'antagonistic')),
    add constraint crop_relations_evidence_check check (evidence in ('research', 'common_practice')),
    add constraint crop_relations_severity_check check (severity is null or severity in ('clash', 'watch')),
    add constraint crop_relations_pair_check check (crop_a_id <> crop_b_id)`);

  await knex.schema.createTable('plantings', (t) => {
    t.increments('id');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('season_id').notNullable().references('seasons.id').onDelete('CASCADE');
    t.integer('crop_id').notNullable().references('crops.id').onDelete('RESTRICT');
    t.string('variety', 120).notNullable().defaultTo('');
    // Part of the plot in plot coordinates (metres from the plot's own corner); all null for the whole plot.
    t.decimal('part_x_m', 8, 3).nullable();
    t.decimal('part_y_m', 8, 3).nullable();
    t.decimal('part_width_m', 8, 3).nullable();
    t.decimal('part_length_m', 8, 3).nullable();
    t.string('method', 12).notNullable();
    t.date('planted_on').notNullable();
    t.string('layout', 10).notNullable().defaultTo('rows');
    t.integer('row_count').nullable();
    t.integer('quantity').nullable();
    t.string('status', 12).notNullable().defaultTo('planned');
    t.text('notes').notNullable().defaultTo('');
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.index(['plot_id', 'season_id']);
    t.index(['season_id']);
  });
  await knex.raw(`alter table plantings
    add constraint plantings_method_check check (method in ('sown', 'transplanted')),
    add constraint plantings_layout_check check (layout in ('rows', 'intensive')),
    add constraint plantings_status_check check (status in ('planned', 'sown', 'up', 'harvesting', 'finished', 'failed')),
    add constraint plantings_part_check check (
      (part_x_m is null and part_y_m is null and part_width_m is null and part_length_m is null) or
      (part_x_m >= 0 and part_y_m >= 0 and part_width_m > 0 and part_length_m > 0)),
    add constraint plantings_counts_check check ((row_count is null or row_count > 0) and (quantity is null or quantity > 0))`);

  await knex.schema.createTable('harvests', (t) => {
    t.increments('id');
    t.integer('planting_id').notNullable().references('plantings.id').onDelete('CASCADE');
    t.date('harvested_on').notNullable();
    t.decimal('grams', 10, 1).nullable();
    t.integer('count').nullable();
    t.text('notes').notNullable().defaultTo('');
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['planting_id']);
  });
  await knex.raw(`alter table harvests add constraint harvests_amount_check
    check ((grams is not null and grams > 0) or (count is not null and count > 0))`);

  await knex.schema.createTable('observations', (t) => {
    t.increments('id');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    t.integer('planting_id').nullable().references('plantings.id').onDelete('SET NULL');
    // A pest or disease from shared/crops/pests.ts by slug, or a free-text name.
    t.string('pest_slug', 60).nullable();
    t.string('name', 120).notNullable();
    t.string('kind', 8).notNullable();
    // Soil-borne diseases are kept against the soil (the plot, or the part below) for the rotation rules.
    t.boolean('is_soil_borne').notNullable().defaultTo(false);
    t.decimal('part_x_m', 8, 3).nullable();
    t.decimal('part_y_m', 8, 3).nullable();
    t.decimal('part_width_m', 8, 3).nullable();
    t.decimal('part_length_m', 8, 3).nullable();
    t.string('severity', 8).notNullable();
    t.date('observed_on').notNullable();
    t.text('notes').notNullable().defaultTo('');
    t.integer('created_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['plot_id']);
  });
  await knex.raw(`alter table observations
    add constraint observations_kind_check check (kind in ('pest', 'disease', 'other')),
    add constraint observations_severity_check check (severity in ('light', 'moderate', 'severe'))`);

  await knex.schema.createTable('observation_photos', (t) => {
    t.increments('id');
    t.integer('observation_id').notNullable().references('observations.id').onDelete('CASCADE');
    t.string('file_name', 80).notNullable();
    t.string('thumb_name', 80).notNullable();
    t.string('mime', 40).notNullable();
    t.integer('width_px').notNullable();
    t.integer('height_px').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['observation_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['observation_photos', 'observations', 'harvests', 'plantings', 'crop_relations', 'crop_overrides', 'crops']) {
    await knex.schema.dropTable(table);
  }
  await knex.schema.alterTable('sites', (t) => t.dropColumn('soil_temps_c'));
  await knex.raw('alter table clubs drop constraint clubs_rotation_gap_check');
  await knex.schema.alterTable('clubs', (t) => {
    t.dropColumn('rotation_gap_years');
    t.dropColumn('shares_plot_books');
  });
}
