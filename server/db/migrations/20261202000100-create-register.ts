import type { QueryInterface } from 'sequelize';

export const name = '20261202000100-create-register';

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create table people (
      id uuid primary key,
      subject text not null,
      issuer text not null,
      name text not null,
      email text,
      roles_from_idp text[] not null default '{}',
      roles_granted text[] not null default '{}',
      roles_withdrawn text[] not null default '{}',
      last_sign_in_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (issuer, subject)
    );

    create table lines (
      id uuid primary key default gen_random_uuid(),
      line_number text not null unique,
      area text not null,
      service text not null,
      material text not null check (material in ('PVC', 'CPVC', 'ABS')),
      schedule text,
      sdr real,
      nominal_size text not null,
      nominal_size_in real not null,
      design_pressure_psi real not null check (design_pressure_psi >= 0),
      design_temperature_f real not null,
      drawing_ref text,
      notes text,
      status text not null default 'in-service' check (status in ('in-service', 'out-of-service', 'locked-out')),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      check (schedule is not null or sdr is not null)
    );
    create index lines_area_idx on lines (area);
    create index lines_material_idx on lines (material);
    create index lines_size_idx on lines (nominal_size_in);

    create table isolation_points (
      id uuid primary key default gen_random_uuid(),
      tag text not null unique,
      line_id uuid not null references lines (id) on delete cascade,
      kind text not null check (kind in ('valve', 'blind', 'disconnect')),
      normal_position text not null,
      notes text,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create index isolation_points_line_idx on isolation_points (line_id);

    create table line_imports (
      id uuid primary key,
      kind text not null check (kind in ('lines', 'isolation-points')),
      filename text not null,
      status text not null check (status in ('previewing', 'previewed', 'applying', 'applied', 'failed')),
      source text not null,
      total_rows integer not null default 0,
      counts jsonb not null default '{"new":0,"changed":0,"unchanged":0,"rejected":0}',
      progress integer not null default 0,
      error text,
      created_by_id uuid not null references people (id),
      confirmed_by_id uuid references people (id),
      applied_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );

    create table line_import_rows (
      id bigserial primary key,
      import_id uuid not null references line_imports (id) on delete cascade,
      row_number integer not null,
      outcome text not null,
      key text,
      data jsonb,
      changes jsonb,
      problems jsonb
    );
    create index line_import_rows_import_idx on line_import_rows (import_id, row_number);

    create table audit_entries (
      id bigserial primary key,
      at timestamptz not null default now(),
      actor_id uuid references people (id),
      action text not null,
      entity text not null,
      entity_id text,
      before jsonb,
      after jsonb
    );
    create index audit_entries_entity_idx on audit_entries (entity, entity_id);

    -- The audit log is append-only: no row may be changed or removed once written.
    create function audit_entries_append_only() returns trigger language plpgsql as $$
    begin
      raise exception 'audit entries are append-only';
    end $$;
    create trigger audit_entries_no_change before update or delete on audit_entries
      for each row execute function audit_entries_append_only();

    -- Sessions (connect-pg-simple's table layout).
    create table user_sessions (
      sid varchar primary key,
      sess json not null,
      expire timestamp(6) not null
    );
    create index user_sessions_expire_idx on user_sessions (expire);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    drop table if exists user_sessions, audit_entries, line_import_rows, line_imports, isolation_points, lines, people cascade;
    drop function if exists audit_entries_append_only();
  `);
}
