import type { QueryInterface, Sequelize } from "sequelize";

// Calibration from measured lots.
// - calibration_settings: the shop's setting (lots a class needs before its fit is used), one row.
// - measured_lot_records / measured_part_records: decided lots with their design and measured
//   parts, for the calibration to read until the quality records (lots, measurements,
//   certificates) hold them; the demo scenario's invented lots live here.
// - calibration_measured_parts: THE view the calibration reads (server/services/measuredLotsReader.ts).
//   A later migration replaces it with a select over the quality records, same columns.
// - calibration_runs / calibration_fits: every refit is kept (who asked, when, the lots used), so a
//   quote's prediction can name the fit it used.
export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    create table calibration_settings (
      id integer primary key default 1 check (id = 1),
      min_lots integer not null default 5 check (min_lots between 2 and 200),
      updated_by_id uuid references users (id),
      updated_at timestamptz not null default now()
    );
    insert into calibration_settings (id) values (1);

    create table measured_lot_records (
      lot_id uuid primary key default gen_random_uuid(),
      number varchar(40) not null unique,
      disposition varchar(10) not null check (disposition in ('accepted', 'rejected')),
      decided_at timestamptz not null,
      required_attenuation_db double precision not null,
      -- the design as a prediction body with its method (no field: that is each part's test)
      design jsonb not null,
      created_at timestamptz not null default now()
    );
    create table measured_part_records (
      id uuid primary key default gen_random_uuid(),
      lot_id uuid not null references measured_lot_records (lot_id) on delete cascade,
      serial varchar(60) not null,
      frequency_hz double precision not null check (frequency_hz >= 0),
      applied_field_ut double precision not null check (applied_field_ut > 0),
      orientation varchar(12) not null default 'transverse' check (orientation in ('transverse', 'axial')),
      attenuation_db double precision not null,
      unique (lot_id, serial)
    );

    create view calibration_measured_parts as
      select l.lot_id, l.number as lot_number, l.disposition, l.decided_at, l.required_attenuation_db, l.design,
             p.serial, p.frequency_hz, p.applied_field_ut, p.orientation, p.attenuation_db
      from measured_lot_records l join measured_part_records p on p.lot_id = l.lot_id;

    create table calibration_runs (
      id uuid primary key default gen_random_uuid(),
      fitted_at timestamptz not null default now(),
      fitted_by_id uuid references users (id),
      reason varchar(200) not null,
      min_lots integer not null,
      lots integer not null,
      -- lots measured and their latest decision: a scheduled check refits only when it changed
      fingerprint varchar(100) not null,
      waiting jsonb not null default '[]',
      unclassified jsonb not null default '[]'
    );
    create index calibration_runs_fitted_at on calibration_runs (fitted_at desc);

    create table calibration_fits (
      id uuid primary key default gen_random_uuid(),
      run_id uuid not null references calibration_runs (id) on delete cascade,
      material varchar(40) not null,
      method varchar(10) not null,
      construction varchar(20) not null,
      in_use boolean not null,
      lots integer not null,
      mu_effective double precision not null,
      ceiling_db double precision not null,
      error_db jsonb not null,
      lots_used jsonb not null,
      -- the whole fit: uncertainty, band, outliers, scatter points, verdict
      fit jsonb not null,
      fitted_at timestamptz not null,
      unique (run_id, material, method, construction)
    );
  `);
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    drop table if exists calibration_fits;
    drop table if exists calibration_runs;
    drop view if exists calibration_measured_parts;
    drop table if exists measured_part_records;
    drop table if exists measured_lot_records;
    drop table if exists calibration_settings;
  `);
}
