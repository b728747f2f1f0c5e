import type { QueryInterface, Sequelize } from "sequelize";

// The calibration's view now reads the quality records too: every decided lot's measured parts
// (the round it was decided in), its design from the quote its order was placed on (the prediction
// body with its method; the test field is each part's own). The invented lots of
// measured_lot_records stay beside them (the demo's history before this shop kept records here).
const RECORDED = `
  select l.lot_id, l.number::text as lot_number, l.disposition::text as disposition, l.decided_at, l.required_attenuation_db, l.design,
         p.serial::text as serial, p.frequency_hz, p.applied_field_ut, p.orientation::text as orientation, p.attenuation_db
  from measured_lot_records l join measured_part_records p on p.lot_id = l.lot_id`;

export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    drop view calibration_measured_parts;
    create view calibration_measured_parts as
      ${RECORDED}
      union all
      select lo.id, lo.number::text, d.decision::text, d.created_at, m.required_db,
             q.configuration - 'field' - 'state' - 'requiredAttenuation_db',
             m.serial::text, m.frequency_hz, m.applied_field_ut, m.orientation::text, m.attenuation_db
      from lot_dispositions d
      join lots lo on lo.id = d.lot_id
      join orders o on o.id = lo.order_id
      join quotes q on q.id = o.quote_id
      join measurements m on m.lot_id = d.lot_id and m.round = d.round;
  `);
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`
    drop view calibration_measured_parts;
    create view calibration_measured_parts as ${RECORDED};
  `);
}
