import type { Knex } from 'knex';

// The neighbour check's findings, stored and kept current: each change re-checks the plots it can
// affect in its own transaction, so reads never compute. A planting kept despite a clash keeps its reason.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('plantings', (t) => {
    t.text('keep_reason').nullable();
  });
  await knex.schema.createTable('findings', (t) => {
    t.bigIncrements('id');
    t.integer('club_id').notNullable().references('clubs.id').onDelete('CASCADE');
    t.integer('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    t.integer('season_id').notNullable().references('seasons.id').onDelete('CASCADE');
    t.integer('plot_id').notNullable().references('plots.id').onDelete('CASCADE');
    // The planting the finding is about; the others it names are in `peers`.
    t.integer('planting_id').notNullable().references('plantings.id').onDelete('CASCADE');
    t.string('key', 160).notNullable();
    t.string('severity', 6).notNullable();
    t.string('kind', 10).notNullable();
    t.string('rule', 24).notNullable();
    t.text('title').notNullable();
    t.text('message').notNullable();
    t.jsonb('peers').notNullable();
    t.jsonb('source').notNullable();
    t.jsonb('numbers').notNullable();
    t.unique(['planting_id', 'key']);
    t.index(['site_id', 'season_id']);
    t.index(['club_id', 'season_id']);
    t.index(['plot_id']);
  });
  await knex.raw(`alter table findings
    add constraint findings_severity_check check (severity in ('clash', 'watch', 'good')),
    add constraint findings_kind_check check (kind in ('rotation', 'companion', 'shade', 'site_fit'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('findings');
  await knex.schema.alterTable('plantings', (t) => t.dropColumn('keep_reason'));
}
