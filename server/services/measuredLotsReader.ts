import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { MeasuredDesign, MeasuredLot, MeasuredPart } from "../../shared/calibration";

// THE seam through which calibration and the control charts read measured lots: the view
// `calibration_measured_parts` (migration 0040), one row per measured part of a decided lot:
//   lot_id uuid, lot_number text, disposition 'accepted'|'rejected', decided_at timestamptz,
//   required_attenuation_db float, design jsonb (a prediction body with "method"; no field),
//   serial text, frequency_hz float, applied_field_ut float, orientation 'transverse'|'axial',
//   attenuation_db float.
// Today it selects from measured_lot_records/measured_part_records; once the quality records hold
// lots, measurements and certificates, a migration replaces the view with a select over them.

export type MeasuredLotsReader = (transaction?: Transaction) => Promise<MeasuredLot[]>;

interface Row {
  lot_id: string;
  lot_number: string;
  disposition: "accepted" | "rejected";
  decided_at: Date | string;
  required_attenuation_db: number;
  design: MeasuredDesign;
  serial: string;
  frequency_hz: number;
  applied_field_ut: number;
  orientation: "transverse" | "axial" | null;
  attenuation_db: number;
}

export function createMeasuredLotsReader(sequelize: Sequelize): MeasuredLotsReader {
  return async (transaction) => {
    const rows = await sequelize.query<Row>(
      "select * from calibration_measured_parts order by decided_at, lot_number, serial",
      { type: QueryTypes.SELECT, transaction },
    );
    const lots = new Map<string, MeasuredLot>();
    for (const r of rows) {
      let lot = lots.get(r.lot_id);
      if (!lot) {
        lot = {
          lotId: r.lot_id, number: r.lot_number, disposition: r.disposition, decidedAt: new Date(r.decided_at).toISOString(),
          requiredAttenuation_db: Number(r.required_attenuation_db), parts: [],
        };
        lots.set(r.lot_id, lot);
      }
      const part: MeasuredPart = {
        lotId: r.lot_id, disposition: r.disposition, serial: r.serial, design: r.design, frequency_hz: Number(r.frequency_hz),
        appliedField_uT: Number(r.applied_field_ut), orientation: r.orientation ?? "transverse", measured_db: Number(r.attenuation_db),
      };
      lot.parts.push(part);
    }
    return [...lots.values()];
  };
}

/** What the lots are now: a scheduled check refits only when it changed. */
export async function measuredLotsFingerprint(sequelize: Sequelize): Promise<string> {
  const [row] = await sequelize.query<{ lots: number; parts: number; latest: Date | null }>(
    "select count(distinct lot_id)::int as lots, count(*)::int as parts, max(decided_at) as latest from calibration_measured_parts",
    { type: QueryTypes.SELECT },
  );
  return `${row.lots}/${row.parts}/${row.latest ? new Date(row.latest).toISOString() : "-"}`;
}
