import type { QueryInterface } from 'sequelize';

export const name = '20261205000100-line-import-preview-speed';

// Three changes that make a large import's preview and apply cheaper (bench/README.md, third round):
//
// 1. A lines preview keeps each new or changed line's values in columns typed as `lines` has them,
//    instead of a jsonb document: the preview writes them by COPY without building or parsing JSON,
//    and the apply copies them into `lines` as they are. `data` stays for what a rejected row said
//    and for isolation points.
// 2. The foreign key line_import_rows.import_id → line_imports is checked once per statement (a
//    COPY batch of 10,000 rows) by a trigger on the statement's new rows, instead of once per row:
//    the per-row check was about half the cost of writing the preview. Deleting an import still
//    deletes its rows (a statement trigger too).
// 3. A preview row is known by its import and row number (one row per row of the file), so that
//    pair is the primary key, and the serial id and its index go: one index and one sequence step
//    less for each of 100,000 rows.
// 4. The stored file is compressed with lz4 where the server has it (pglz took ~0.3 s for 8 MB).
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table line_import_rows
      add column area text,
      add column service text,
      add column material text,
      add column schedule text,
      add column sdr real,
      add column nominal_size text,
      add column nominal_size_in real,
      add column design_pressure_psi real,
      add column design_temperature_f real,
      add column drawing_ref text,
      add column notes text,
      drop constraint line_import_rows_import_id_fkey,
      drop constraint line_import_rows_pkey,
      drop column id,
      add primary key (import_id, row_number);
    drop index line_import_rows_import_idx;

    create function line_import_rows_import_exists() returns trigger language plpgsql as $$
    begin
      if exists (select 1 from new_rows n where not exists (select 1 from line_imports i where i.id = n.import_id)) then
        raise foreign_key_violation using message = 'line_import_rows.import_id must name a row of line_imports';
      end if;
      return null;
    end $$;
    create trigger line_import_rows_import_exists after insert on line_import_rows
      referencing new table as new_rows for each statement execute function line_import_rows_import_exists();
    create trigger line_import_rows_import_still_exists after update on line_import_rows
      referencing new table as new_rows for each statement execute function line_import_rows_import_exists();

    create function line_imports_delete_rows() returns trigger language plpgsql as $$
    begin
      delete from line_import_rows r using old_imports o where r.import_id = o.id;
      return null;
    end $$;
    create trigger line_imports_delete_rows after delete on line_imports
      referencing old table as old_imports for each statement execute function line_imports_delete_rows();

    do $$
    begin
      if exists (select 1 from pg_settings where name = 'default_toast_compression' and 'lz4' = any (enumvals)) then
        alter table line_imports alter column source set compression lz4;
      end if;
    end $$;
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table line_imports alter column source set compression default;
    drop trigger line_imports_delete_rows on line_imports;
    drop function line_imports_delete_rows();
    drop trigger line_import_rows_import_exists on line_import_rows;
    drop trigger line_import_rows_import_still_exists on line_import_rows;
    drop function line_import_rows_import_exists();
    update line_import_rows set data = jsonb_build_object(
      'lineNumber', key, 'area', area, 'service', service, 'material', material, 'schedule', schedule, 'sdr', sdr,
      'nominalSize', nominal_size, 'nominalSizeIn', nominal_size_in, 'designPressurePsi', design_pressure_psi,
      'designTemperatureF', design_temperature_f, 'drawingRef', drawing_ref, 'notes', notes)
    where area is not null;
    alter table line_import_rows
      drop column area, drop column service, drop column material, drop column schedule, drop column sdr,
      drop column nominal_size, drop column nominal_size_in, drop column design_pressure_psi,
      drop column design_temperature_f, drop column drawing_ref, drop column notes,
      drop constraint line_import_rows_pkey,
      add column id bigserial primary key,
      add constraint line_import_rows_import_id_fkey foreign key (import_id) references line_imports (id) on delete cascade;
    create index line_import_rows_import_idx on line_import_rows (import_id, row_number);
  `);
}
