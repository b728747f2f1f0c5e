import type { QueryInterface, Sequelize } from "sequelize";

// Quality records of a lot: the attenuation measured on each sampled part, the lot's disposition
// under its sampling plan (one per inspection round: a lot sent back for another anneal is sampled
// again), nonconformance records for rejected lots, and certificates of conformance.
//
// An issued certificate never changes: a correction is a new revision that supersedes it (the old
// one stays, verifiable, and is shown as superseded because a newer revision names it). The
// database refuses any UPDATE or DELETE of a certificate, whatever the code does.
export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    alter table lots add column inspection_round smallint not null default 1 check (inspection_round >= 1);

    create table measurements (
      id uuid primary key default gen_random_uuid(),
      lot_id uuid not null references lots (id),
      round smallint not null,
      serial varchar(60) not null,
      frequency_hz double precision not null check (frequency_hz >= 0),
      applied_field_ut double precision not null check (applied_field_ut > 0),
      inside_field_ut double precision not null check (inside_field_ut > 0),
      orientation varchar(12) not null check (orientation in ('transverse', 'axial')),
      probe_position varchar(120) not null,
      instrument_id uuid not null references instruments (id),
      instrument_calibration_due date not null,
      -- how the fields were found: entered, or from a Helmholtz set's current / a search coil's voltage
      derivation jsonb not null default '{}',
      shielding_factor double precision not null,
      attenuation_db double precision not null,
      required_db double precision not null,
      predicted_db double precision,
      pass boolean not null,
      source varchar(10) not null default 'entry' check (source in ('entry', 'csv')),
      measured_by_id uuid references users (id),
      created_at timestamptz not null default now(),
      constraint measurements_one_per_part unique (lot_id, round, serial)
    );
    create trigger measurements_no_update before update or delete on measurements for each row execute function events_append_only();

    create table lot_dispositions (
      id uuid primary key default gen_random_uuid(),
      lot_id uuid not null references lots (id),
      round smallint not null,
      decision varchar(10) not null check (decision in ('accepted', 'rejected')),
      plan jsonb not null,
      measured integer not null,
      failures integer not null,
      -- accepted by concession: the customer's written consent to use a rejected lot as is
      concession text,
      decided_by_id uuid references users (id),
      created_at timestamptz not null default now(),
      constraint lot_dispositions_one_per_round unique (lot_id, round)
    );

    create sequence nonconformance_number_seq start 101;
    create table nonconformances (
      id uuid primary key default gen_random_uuid(),
      number varchar(20) not null unique default ('NC-' || nextval('nonconformance_number_seq')::text),
      lot_id uuid not null references lots (id),
      round smallint not null,
      description text not null,
      cause text,
      disposition varchar(20) check (disposition in ('reanneal-retest', 'rework', 'scrap', 'use-as-is')),
      customer_consent text,
      status varchar(10) not null default 'open' check (status in ('open', 'closed')),
      opened_by_id uuid references users (id),
      closed_by_id uuid references users (id),
      closed_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      constraint nonconformances_consent check (disposition is distinct from 'use-as-is' or length(trim(coalesce(customer_consent, ''))) > 0),
      constraint nonconformances_closed check ((status = 'closed') = (disposition is not null and closed_at is not null))
    );
    create index nonconformances_lot on nonconformances (lot_id, created_at);
    create index nonconformances_open on nonconformances (created_at) where status = 'open';

    -- certificate numbers: certificate_number_seq from migration 0001
    create table certificates (
      id uuid primary key default gen_random_uuid(),
      number varchar(20) not null,
      revision smallint not null check (revision >= 1),
      lot_id uuid not null references lots (id),
      order_id uuid not null references orders (id),
      organization_id uuid not null references organizations (id),
      supersedes_id uuid unique references certificates (id),
      revision_reason text,
      content jsonb not null,
      digest char(64) not null unique check (digest ~ '^[0-9a-f]{64}$'),
      pdf bytea not null,
      pdf_sha256 char(64) not null unique,
      issued_by_id uuid references users (id),
      issued_at timestamptz not null,
      created_at timestamptz not null default now(),
      constraint certificates_revision unique (number, revision)
    );
    create index certificates_lot on certificates (lot_id, revision);
    create index certificates_order on certificates (order_id);
    -- one first revision per lot
    create unique index certificates_first_per_lot on certificates (lot_id) where revision = 1;

    create function certificates_immutable() returns trigger language plpgsql as $$
    begin raise exception 'issued certificates never change: issue a new revision instead' using errcode = 'P0001'; end $$;
    create trigger certificates_no_change before update or delete on certificates for each row execute function certificates_immutable();
    create trigger certificates_no_truncate before truncate on certificates for each statement execute function certificates_immutable();
  `);
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    drop table if exists certificates;
    drop function if exists certificates_immutable();
    drop table if exists nonconformances;
    drop sequence if exists nonconformance_number_seq;
    drop table if exists lot_dispositions;
    drop table if exists measurements;
    alter table lots drop column if exists inspection_round;
  `);
}
