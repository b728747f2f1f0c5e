import type { QueryInterface, Sequelize } from "sequelize";

// Each ask for a refit (a certificate issued, a refit by hand, a changed setting) is kept until a
// refit answers it. The job queue keeps at most one refit waiting, so asks made while one waits
// are answered by that one: the run names every ask it answered, and a forced ask is never lost
// to an unforced one that finds nothing new.
export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    create table calibration_refit_requests (
      id uuid primary key default gen_random_uuid(),
      -- the clock, not the transaction's start: asks made in one transaction keep their order
      requested_at timestamptz not null default clock_timestamp(),
      requested_by_id uuid references users (id),
      reason varchar(200) not null,
      force boolean not null default false,
      answered_at timestamptz,
      -- the run that answered it; null when answered and the lots had not changed
      run_id uuid references calibration_runs (id) on delete set null
    );
    create index calibration_refit_requests_open on calibration_refit_requests (requested_at) where answered_at is null;
    -- a run answering several asks names them all
    alter table calibration_runs alter column reason type varchar(1000);
  `);
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    drop table calibration_refit_requests;
    alter table calibration_runs alter column reason type varchar(200) using left(reason, 200);
  `);
}
