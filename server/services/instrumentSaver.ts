import type { Transaction } from "sequelize";
import type { InstrumentCreateInput, InstrumentUpdateInput } from "../../shared/schemas/instrument";
import { ConflictError, ValidationError } from "../errors";
import { Instrument, recordEvent } from "../models";
import type { Actor } from "../policies/utils";

type Figures = { kind: Instrument["kind"]; turns: number | null; area_mm2: number | null; radius_mm: number | null };

/** The figures the measurement arithmetic needs, checked on the record as it will be saved. */
function checkFigures(i: Figures): void {
  if (i.kind === "search-coil" && (i.turns == null || i.area_mm2 == null)) {
    throw ValidationError({ [i.turns == null ? "turns" : "area_mm2"]: "A search coil needs its turns and the area of one turn." });
  }
  if (i.kind === "helmholtz-coil" && (i.turns == null || i.radius_mm == null)) {
    throw ValidationError({ [i.turns == null ? "turns" : "radius_mm"]: "A Helmholtz coil set needs its turns per coil and its radius." });
  }
}

async function nameTaken(name: string, transaction: Transaction, exceptId?: string): Promise<void> {
  const same = await Instrument.findOne({ where: Instrument.sequelize!.where(Instrument.sequelize!.fn("lower", Instrument.sequelize!.col("name")), name.toLowerCase()), transaction });
  if (same && same.id !== exceptId) throw ConflictError("INSTRUMENT_NAME_TAKEN", `An instrument is already called ${same.name}; give this one another name.`);
}

/** Adds an instrument to the register with its current due date; the certificate comes with its calibration record. */
export async function instrumentCreator(props: { actor: Actor; input: InstrumentCreateInput; ip: string | null; transaction: Transaction }): Promise<Instrument> {
  const { actor, input, transaction } = props;
  await nameTaken(input.name, transaction);
  const instrument = await Instrument.create(
    {
      name: input.name,
      kind: input.kind,
      serialNumber: input.serialNumber || null,
      make: input.make || null,
      range: input.range || null,
      turns: input.turns ?? null,
      area_mm2: input.area_mm2 ?? null,
      radius_mm: input.radius_mm ?? null,
      notes: input.notes || null,
      calibrationDue: input.calibrationDue,
      lastCalibratedOn: input.lastCalibratedOn ?? null,
      createdById: actor.id,
    },
    { transaction },
  );
  await recordEvent({ actor, action: "instrument.created", subject: { type: "instrument", id: instrument.id }, data: { name: instrument.name, kind: instrument.kind, calibrationDue: instrument.calibrationDue }, ip: props.ip }, transaction);
  return instrument;
}

const EDITABLE = ["name", "serialNumber", "make", "range", "turns", "area_mm2", "radius_mm", "notes", "calibrationDue"] as const;

/** Changes an instrument's details (locked by the caller); records which fields changed. */
export async function instrumentUpdater(props: { actor: Actor; instrument: Instrument; input: InstrumentUpdateInput; ip: string | null; transaction: Transaction }): Promise<Instrument> {
  const { actor, instrument, input, transaction } = props;
  const changed: string[] = [];
  for (const key of EDITABLE) {
    const value = input[key];
    if (value === undefined) continue;
    const next = value === "" ? null : value;
    if (instrument[key] !== next) {
      (instrument as unknown as Record<string, unknown>)[key] = next;
      changed.push(key);
    }
  }
  if (!changed.length) return instrument;
  checkFigures(instrument);
  if (changed.includes("name")) await nameTaken(instrument.name, transaction, instrument.id);
  // a new due date is a new reminder's occasion
  if (changed.includes("calibrationDue")) instrument.reminderSentFor = null;
  await instrument.save({ transaction });
  await recordEvent({ actor, action: "instrument.updated", subject: { type: "instrument", id: instrument.id }, data: { fields: changed, ...(changed.includes("calibrationDue") ? { calibrationDue: instrument.calibrationDue } : {}) }, ip: props.ip }, transaction);
  return instrument;
}
