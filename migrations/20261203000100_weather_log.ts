import type { Knex } from 'knex';

// A site's elevation (whole metres above sea level) and its daily weather log: one row per site and
// calendar day in the site's zone, every value in SI and each one optional (a rain gauge gives only
// rain). Sites with records are archived, not deleted (DEVELOPERS.md), so the log is such a record:
// a site with weather on file cannot be deleted (restrict), and archiving keeps the days.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (t) => {
    t.integer('elevation_m').nullable();
  });
  await knex.raw('alter table sites add constraint sites_elevation_check check (elevation_m is null or elevation_m between -500 and 9000)');

  await knex.schema.createTable('weather_days', (t) => {
    t.increments('id');
    t.integer('site_id').notNullable().references('sites.id').onDelete('RESTRICT');
    t.date('day').notNullable();
    // Kept to the precision the conversions from US units need: 0.01 °C, 0.001 mm (0.01 in = 0.254 mm),
    // 0.1 % RH, 0.001 m/s (1 mph = 0.44704 m/s), 0.001 m, 0.01 h, 0.01 MJ/m².
    t.decimal('t_min_c', 5, 2).nullable();
    t.decimal('t_max_c', 5, 2).nullable();
    t.decimal('rain_mm', 7, 3).nullable();
    t.decimal('rh_min_pct', 4, 1).nullable();
    t.decimal('rh_max_pct', 4, 1).nullable();
    t.decimal('rh_mean_pct', 4, 1).nullable();
    t.decimal('wind_ms', 6, 3).nullable();
    t.decimal('wind_height_m', 6, 3).nullable();
    t.decimal('sunshine_h', 4, 2).nullable();
    t.decimal('solar_mj_m2', 5, 2).nullable();
    t.integer('entered_by_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.string('source', 8).notNullable();
    t.timestamps(true, true);
    t.unique(['site_id', 'day']);
  });
  await knex.raw(`alter table weather_days
    add constraint weather_days_source_check check (source in ('gauge', 'form', 'import')),
    add constraint weather_days_day_check check (day >= date '2000-01-01'),
    add constraint weather_days_t_order_check check (t_min_c is null or t_max_c is null or t_min_c <= t_max_c),
    add constraint weather_days_t_range_check check ((t_min_c is null or t_min_c between -60 and 60) and (t_max_c is null or t_max_c between -60 and 60)),
    add constraint weather_days_rain_check check (rain_mm is null or rain_mm between 0 and 1000),
    add constraint weather_days_rh_check check (
      (rh_min_pct is null or rh_min_pct between 0 and 100) and (rh_max_pct is null or rh_max_pct between 0 and 100)
      and (rh_mean_pct is null or rh_mean_pct between 0 and 100)
      and (rh_min_pct is null or rh_max_pct is null or rh_min_pct <= rh_max_pct)),
    add constraint weather_days_wind_check check (wind_ms is null or wind_ms between 0 and 100),
    add constraint weather_days_wind_height_check check (wind_height_m is null or wind_height_m between 0.5 and 100),
    add constraint weather_days_sunshine_check check (sunshine_h is null or sunshine_h between 0 and 24),
    add constraint weather_days_solar_check check (solar_mj_m2 is null or solar_mj_m2 between 0 and 50)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('weather_days');
  await knex.raw('alter table sites drop constraint sites_elevation_check');
  await knex.schema.alterTable('sites', (t) => t.dropColumn('elevation_m'));
}
