import type { Transaction } from "sequelize";
import { utcDay } from "../../shared/quality/instruments";
import type { InstrumentKind } from "../../shared/schemas/instrument";
import { Instrument, InstrumentCalibration, recordEvent, type User } from "../models";

// The demo's instrument register (invented): probes, search coils, a Helmholtz set and a signal
// source; one out for calibration, one overdue, one due within the reminder's 14 days.

const DAY = 86_400_000;
const LAB = "Northmere Calibration Lab (demo)";

interface DemoInstrument {
  name: string;
  kind: InstrumentKind;
  serialNumber: string;
  make: string;
  range?: string;
  turns?: number;
  area_mm2?: number;
  radius_mm?: number;
  /** days from today: negative is past */
  due: number;
  /** sent out this many days ago */
  outSince?: number;
}

const demoInstruments: DemoInstrument[] = [
  { name: "Fluxgate probe FX-3", kind: "fluxgate-probe", serialNumber: "FX3-2291", make: "three-axis fluxgate, bench unit", range: "±100 µT, DC to 1 kHz", due: 140 },
  { name: "Gaussmeter probe HP-1", kind: "gaussmeter-probe", serialNumber: "HP1-0417", make: "transverse Hall probe", range: "0.1 mT to 3 T", due: 10 },
  { name: "Search coil SC-200", kind: "search-coil", serialNumber: "SC200-07", make: "shop-wound, 20 mm former", turns: 200, area_mm2: 314.2, range: "10 Hz to 10 kHz", due: 210 },
  { name: "Helmholtz set HX-500", kind: "helmholtz-coil", serialNumber: "HX500-01", make: "shop-built pair, 500 mm diameter", turns: 100, radius_mm: 250, due: 95 },
  { name: "Signal source SG-2", kind: "signal-source", serialNumber: "SG2-1180", make: "sine generator with current amplifier", range: "1 Hz to 20 kHz, 5 A", due: 300 },
  { name: "Fluxgate probe FX-2 (spare)", kind: "fluxgate-probe", serialNumber: "FX2-1876", make: "single-axis fluxgate", range: "±200 µT", due: 3, outSince: 6 },
  { name: "Search coil SC-50", kind: "search-coil", serialNumber: "SC50-02", make: "shop-wound, 10 mm former", turns: 50, area_mm2: 78.5, range: "50 Hz to 5 kHz", due: -12 },
];

export async function seedInstruments(props: { qa: User; transaction: Transaction; now?: Date }): Promise<string[]> {
  const { qa, transaction } = props;
  const now = props.now ?? new Date();
  const day = (offset: number) => utcDay(new Date(now.getTime() + offset * DAY));
  const existing = new Set((await Instrument.findAll({ attributes: ["name"], transaction })).map((i) => i.name));
  const created: string[] = [];
  for (const d of demoInstruments) {
    if (existing.has(d.name)) continue;
    const calibratedOn = day(d.due - 365);
    const instrument = await Instrument.create(
      {
        name: d.name, kind: d.kind, serialNumber: d.serialNumber, make: d.make, range: d.range ?? null,
        turns: d.turns ?? null, area_mm2: d.area_mm2 ?? null, radius_mm: d.radius_mm ?? null, notes: null,
        calibrationDue: day(d.due), lastCalibratedOn: calibratedOn, createdById: qa.id,
        ...(d.outSince !== undefined ? { status: "in-calibration" as const, calibrationSentOn: day(-d.outSince), calibrationLaboratory: LAB } : {}),
      },
      { transaction },
    );
    await InstrumentCalibration.create(
      { instrumentId: instrument.id, calibratedOn, calibrationDue: day(d.due), laboratory: LAB, certificateNumber: `NCL-${d.serialNumber}`, storedFileId: null, recordedById: qa.id },
      { transaction },
    );
    await recordEvent({ actor: qa, action: "instrument.created", subject: { type: "instrument", id: instrument.id }, data: { name: d.name, kind: d.kind, calibrationDue: day(d.due) }, at: new Date(now.getTime() - 400 * DAY) }, transaction);
    if (d.outSince !== undefined) {
      await recordEvent({ actor: qa, action: "instrument.sent-to-calibration", subject: { type: "instrument", id: instrument.id }, data: { sentOn: day(-d.outSince), laboratory: LAB }, at: new Date(now.getTime() - d.outSince * DAY) }, transaction);
    }
    created.push(d.name);
  }
  return created.length ? [`instruments ${created.join(", ")}`] : [];
}
