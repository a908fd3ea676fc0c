import type { QueryInterface } from 'sequelize';

export const name = '20261207000100-lockout-and-joint-steps';

// Lockout and the shift tablet (DESIGN.md sections 3, 9 and 10): the group lock box, personal locks,
// the verification of zero energy, each joint's recorded steps (and the dry fits the server
// refused), the set and cure holds that assembly creates, joint photos, and the idempotency keys
// that make a replayed write from the tablet record nothing twice.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    -- The group lock box of an order (1910.147(f)(3)): the keys of its points sit in it, and one
    -- authorized person holds primary responsibility for it.
    create table lock_boxes (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null unique references work_orders (id) on delete cascade,
      label text not null,
      responsible_person_id uuid not null references people (id),
      created_at timestamptz not null default now()
    );
    alter table isolation_plan_entries add column lock_box_id uuid references lock_boxes (id);

    -- One person's lock on one point of the plan, or on the order's box. Never deleted: removal is
    -- recorded (by whom, how), so the board and the audit show who was locked on where and when.
    create table locks (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      person_id uuid not null references people (id),
      lock_number text not null,
      isolation_plan_entry_id uuid references isolation_plan_entries (id),
      lock_box_id uuid references lock_boxes (id),
      applied_at timestamptz not null,
      handed_over_from_lock_id uuid references locks (id),
      removed_at timestamptz,
      removed_by_id uuid references people (id),
      removal text check (removal in ('owner', 'absent')),
      absent_record jsonb,
      check ((isolation_plan_entry_id is null) <> (lock_box_id is null)),
      check ((removed_at is null) = (removal is null) and (removed_at is null) = (removed_by_id is null)),
      check ((removal = 'absent') = (absent_record is not null))
    );
    -- A person puts one lock on a point or the box, and a lock number is on one place at a time.
    create unique index locks_on_entry_once on locks (isolation_plan_entry_id, person_id) where removed_at is null and isolation_plan_entry_id is not null;
    create unique index locks_on_box_once on locks (lock_box_id, person_id) where removed_at is null and lock_box_id is not null;
    create unique index locks_number_in_use on locks (work_order_id, lower(lock_number)) where removed_at is null;
    create index locks_order_idx on locks (work_order_id, removed_at);
    create index locks_person_idx on locks (person_id) where removed_at is null;

    -- Zero energy verified for the section ((d)(6)): the positions as found and the proof.
    create table isolation_verifications (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      verified_by_id uuid not null references people (id),
      verified_at timestamptz not null,
      method text not null,
      reading text not null,
      points jsonb not null,
      -- Set when the section's protection lapses (locks off for the test): a new verification is needed.
      superseded_at timestamptz
    );
    create index isolation_verifications_order_idx on isolation_verifications (work_order_id) where superseded_at is null;

    alter table joint_tasks
      add column redo_reason text,
      add column redone_at timestamptz,
      add column redone_by_id uuid references people (id),
      add constraint joint_tasks_redo_check check ((redo_reason is null) = (redone_at is null));
    create unique index joint_tasks_replaced_once on joint_tasks (replaces_task_id) where replaces_task_id is not null;

    create table joint_steps (
      id uuid primary key default gen_random_uuid(),
      joint_task_id uuid not null references joint_tasks (id) on delete cascade,
      step text not null check (step in ('prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly', 'wipe')),
      values jsonb not null,
      recorded_by_id uuid not null references people (id),
      recorded_at timestamptz not null,
      unique (joint_task_id, step)
    );

    -- A dry fit outside 1/3–2/3 of the socket depth: refused, and kept as a retry.
    create table dry_fit_retries (
      id uuid primary key default gen_random_uuid(),
      joint_task_id uuid not null references joint_tasks (id) on delete cascade,
      insertion_in real not null,
      message text not null,
      recorded_by_id uuid not null references people (id),
      recorded_at timestamptz not null
    );
    create index dry_fit_retries_task_idx on dry_fit_retries (joint_task_id);

    -- Something that forbids a next step until it ends (DESIGN.md section 3). Assembly creates a
    -- joint's set and cure holds from the trade engine; a refusal leaves them awaiting a
    -- supervisor's engineering cure time (ends_at null).
    create table holds (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      joint_task_id uuid references joint_tasks (id) on delete cascade,
      kind text not null check (kind in ('set', 'cure')),
      status text not null check (status in ('running', 'awaiting-engineering', 'ended', 'void')),
      starts_at timestamptz not null,
      ends_at timestamptz,
      temperature_f real not null,
      relative_humidity real not null,
      pressure_psi real not null,
      schedule text,
      basis text not null,
      source text,
      ended_at timestamptz,
      ended_by text,
      void_reason text,
      created_at timestamptz not null default now(),
      check ((status = 'awaiting-engineering') = (ends_at is null)),
      check ((status = 'void') = (void_reason is not null))
    );
    create index holds_order_idx on holds (work_order_id, status);
    create index holds_joint_idx on holds (joint_task_id);
    create index holds_due_idx on holds (ends_at) where status = 'running';

    -- A joint's photos, re-encoded without the camera's metadata; served by id to signed-in people.
    create table photos (
      id uuid primary key default gen_random_uuid(),
      joint_task_id uuid not null references joint_tasks (id) on delete cascade,
      step text not null check (step in ('depth-marks', 'wipe')),
      content bytea not null,
      media_type text not null,
      width integer not null,
      height integer not null,
      bytes integer not null,
      taken_by_id uuid not null references people (id),
      created_at timestamptz not null default now()
    );
    create index photos_task_idx on photos (joint_task_id, created_at);

    -- A write from the tablet and its first answer, kept in the write's own transaction: a replay
    -- with the same key answers the first result and records nothing twice.
    create table idempotency_keys (
      person_id uuid not null references people (id),
      key text not null,
      method text not null,
      path text not null,
      request_hash text not null,
      status integer,
      body jsonb,
      created_at timestamptz not null default now(),
      primary key (person_id, key)
    );
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    drop table if exists idempotency_keys, photos, holds, dry_fit_retries, joint_steps, isolation_verifications, locks;
    drop index if exists joint_tasks_replaced_once;
    alter table joint_tasks drop constraint if exists joint_tasks_redo_check,
      drop column if exists redo_reason, drop column if exists redone_at, drop column if exists redone_by_id;
    alter table isolation_plan_entries drop column if exists lock_box_id;
    drop table if exists lock_boxes;
  `);
}
