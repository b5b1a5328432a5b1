import type { Knex } from 'knex';

// sites.map_stamp: the id of the last transaction that added, changed or removed any of the site's
// plots, or changed its path width (txid_current(): it only grows in a cluster and is never reused,
// so a stamp cannot repeat with other content, not even after a truncate or a restore). The map's reads (plots, neighbours) are cached per
// server under (site, stamp); the stamp comes with the role check's query, so a cached read costs no
// extra round trip, and a write on any server is seen by every server's next read.
// Statement-level triggers with transition tables: an import of 2,000 plots updates the site once.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (t) => {
    t.bigInteger('map_stamp').notNullable().defaultTo(0);
  });
  await knex.raw(`
    create function bump_site_map_stamp() returns trigger language plpgsql as $$
    begin
      if tg_op = 'INSERT' then
        update sites set map_stamp = txid_current() where id in (select distinct site_id from new_plots);
      elsif tg_op = 'UPDATE' then
        update sites set map_stamp = txid_current()
          where id in (select site_id from new_plots union select site_id from old_plots);
      else
        update sites set map_stamp = txid_current() where id in (select distinct site_id from old_plots);
      end if;
      return null;
    end $$;
    create trigger plots_map_stamp_insert after insert on plots
      referencing new table as new_plots for each statement execute function bump_site_map_stamp();
    create trigger plots_map_stamp_update after update on plots
      referencing old table as old_plots new table as new_plots for each statement execute function bump_site_map_stamp();
    create trigger plots_map_stamp_delete after delete on plots
      referencing old table as old_plots for each statement execute function bump_site_map_stamp();

    create function bump_own_map_stamp() returns trigger language plpgsql as $$
    begin
      if new.path_width_m is distinct from old.path_width_m then
        new.map_stamp := txid_current();
      end if;
      return new;
    end $$;
    create trigger sites_map_stamp before update on sites for each row execute function bump_own_map_stamp();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger sites_map_stamp on sites;
    drop function bump_own_map_stamp();
    drop trigger plots_map_stamp_insert on plots;
    drop trigger plots_map_stamp_update on plots;
    drop trigger plots_map_stamp_delete on plots;
    drop function bump_site_map_stamp();
  `);
  await knex.schema.alterTable('sites', (t) => {
    t.dropColumn('map_stamp');
  });
}
