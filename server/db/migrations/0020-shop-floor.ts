import type { QueryInterface, Sequelize } from "sequelize";

// The shop floor: material heats (receiving records with their mill certificates), furnace runs,
// lots (the pieces annealed in one run and certified together), jobs (one per part of the
// design, with its routing and where it stands), the scans that move jobs through their steps,
// and shipments. Numbers come from sequences (lot and job from migration 0001).
export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    create sequence furnace_run_number_seq start 1001;

    create table material_heats (
      id uuid primary key default gen_random_uuid(),
      heat_number varchar(40) not null,
      material_id varchar(40) not null references materials (id),
      thickness_mm double precision not null check (thickness_mm > 0),
      supplier varchar(200) not null,
      quantity double precision not null check (quantity > 0),
      unit varchar(10) not null default 'sheets' check (unit in ('sheets', 'kg')),
      received_on date not null default current_date,
      received_by_id uuid references users (id),
      mill_certificate_file_id uuid unique references stored_files (id),
      notes text,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      -- a heat number names one melt: one receiving record per alloy and gauge of it
      constraint material_heats_one_record unique (heat_number, material_id, thickness_mm)
    );
    create index material_heats_received on material_heats (received_on desc, created_at desc);

    create table furnace_runs (
      id uuid primary key default gen_random_uuid(),
      seq integer not null unique default nextval('furnace_run_number_seq'),
      number varchar(20) not null unique,
      furnace_id varchar(20) not null,
      furnace jsonb not null,
      material_id varchar(40) not null references materials (id),
      setpoint_c double precision,
      peak_temperature_c double precision not null,
      soak_min double precision not null,
      dew_point_c double precision not null,
      dew_point_out_c double precision,
      cooling_rate_c_per_h double precision not null,
      "window" jsonb not null,
      within_window boolean not null,
      deviations jsonb not null default '[]',
      -- the load as recorded (a lot sent back for another anneal leaves the run but stays in its load)
      lots jsonb not null,
      pieces integer not null,
      load_kg double precision not null,
      chart_file_id uuid unique references stored_files (id),
      operator_id uuid references users (id),
      notes text,
      ran_at timestamptz not null default now(),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create index furnace_runs_created on furnace_runs (created_at desc);

    create table shipments (
      id uuid primary key default gen_random_uuid(),
      order_id uuid not null references orders (id),
      carrier varchar(100) not null,
      tracking_number varchar(100) not null,
      parts jsonb not null,
      shipped_at timestamptz not null default now(),
      created_by_id uuid references users (id),
      created_at timestamptz not null default now()
    );
    create index shipments_order on shipments (order_id, shipped_at);

    create table lots (
      id uuid primary key default gen_random_uuid(),
      seq integer not null unique,
      number varchar(20) not null unique,
      order_id uuid not null references orders (id),
      material_id varchar(40) not null references materials (id),
      pieces integer not null check (pieces >= 0),
      mass_kg double precision not null default 0,
      due_date date not null,
      furnace_run_id uuid references furnace_runs (id),
      hold_reason text,
      held_at timestamptz,
      held_by_id uuid references users (id),
      shipment_id uuid references shipments (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      constraint lots_hold_complete check ((hold_reason is null) = (held_at is null))
    );
    create index lots_order on lots (order_id, seq);
    -- the floor board's short lists: lots not yet annealed, and lots on hold
    create index lots_awaiting_furnace on lots (due_date) where furnace_run_id is null and shipment_id is null;
    create index lots_on_hold on lots (held_at) where hold_reason is not null;
    create index lots_furnace_run on lots (furnace_run_id) where furnace_run_id is not null;

    create table jobs (
      id uuid primary key default gen_random_uuid(),
      seq integer not null unique default nextval('job_number_seq'),
      -- the value printed in the job's barcode (shared/shop-floor/codes.ts writes it the same way)
      code varchar(20) generated always as ('J-' || seq::text) stored unique,
      order_id uuid not null references orders (id),
      lot_id uuid not null references lots (id),
      assembly_job_id uuid references jobs (id),
      layer smallint not null,
      role varchar(10) not null check (role in ('cup', 'wall', 'end-cap', 'body', 'lid', 'collar')),
      method varchar(10) not null check (method in ('drawn', 'rolled', 'bent')),
      material_id varchar(40) not null references materials (id),
      thickness_mm double precision not null,
      quantity integer not null check (quantity > 0),
      finished_piece boolean not null,
      blank jsonb not null,
      flat_pattern jsonb not null,
      area_mm2 double precision not null,
      mass_kg double precision,
      draw_stages smallint not null default 0,
      process_anneals smallint not null default 0,
      weld_length_mm double precision not null default 0,
      routing jsonb not null,
      -- where the job stands: its first step not completed (= routing length when finished), whether
      -- that step has started, and its key (for the floor board's counts)
      step_index smallint not null default 0,
      step_started_at timestamptz,
      current_step varchar(10),
      anneal_index smallint,
      heat_id uuid references material_heats (id),
      furnace_run_id uuid references furnace_runs (id),
      due_date date not null,
      completed_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      constraint jobs_step_in_routing check (step_index >= 0 and step_index <= jsonb_array_length(routing)),
      constraint jobs_finished check ((completed_at is null) = (current_step is not null))
    ) with (fillfactor = 85);
    create index jobs_lot on jobs (lot_id, seq);
    create index jobs_order on jobs (order_id, seq);
    create index jobs_assembly on jobs (assembly_job_id) where assembly_job_id is not null;
    create index jobs_heat on jobs (heat_id) where heat_id is not null;
    -- open jobs only: the floor board counts them by step and lists the late ones. No index names
    -- step_started_at, and pages keep room (fillfactor), so a step's start updates the row in place
    -- (a heap-only update: no index touched), half of all scans.
    create index jobs_open_step on jobs (current_step) where completed_at is null;
    create index jobs_open_due on jobs (due_date) where completed_at is null;
    -- a lot is ready for its furnace load when no annealed job of it is still before its anneal step
    create index jobs_before_anneal on jobs (lot_id) where anneal_index is not null and step_index < anneal_index;

    -- One row per start and per completion of a job's step: the unique key makes a step start
    -- once and complete once, whatever arrives twice (a second scanner, a replayed offline queue).
    create table scans (
      id bigint generated always as identity primary key,
      job_id uuid not null references jobs (id),
      step_index smallint not null,
      step varchar(10) not null,
      action varchar(10) not null check (action in ('start', 'complete')),
      station varchar(60) not null,
      operator_id uuid references users (id),
      idempotency_key varchar(100),
      data jsonb not null default '{}',
      scanned_at timestamptz not null,
      created_at timestamptz not null default now(),
      constraint scans_once unique (job_id, step_index, action)
    );
    create unique index scans_idempotency_key on scans (idempotency_key) where idempotency_key is not null;
    -- scans are the floor's trail: append-only like the events
    create trigger scans_no_update before update or delete on scans for each row execute function events_append_only();
  `);
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    drop table if exists scans;
    drop table if exists jobs;
    drop table if exists lots;
    drop table if exists shipments;
    drop table if exists furnace_runs;
    drop table if exists material_heats;
    drop sequence if exists furnace_run_number_seq;
  `);
}
