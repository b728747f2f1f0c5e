import type { Instrument } from "../models";
import { definePolicy, type Actor } from "./utils";

/** The quality inspectors and the planner keep the instrument register; nobody else sees it. */
export const isQualityStaff = (a: Actor) => a.role === "qa" || a.role === "admin";

/**
 * Instruments belong to the shop, not to an organisation: other roles get 403 (they may know the
 * register exists). Whether the instrument's status allows an action is the service's 409.
 */
export const instrumentPolicy = definePolicy<Instrument, "read" | "update" | "sendToCalibration" | "returnFromCalibration" | "recordCalibration">({
  name: "instrument",
  see: () => true,
  can: {
    read: isQualityStaff,
    update: isQualityStaff,
    sendToCalibration: isQualityStaff,
    returnFromCalibration: isQualityStaff,
    recordCalibration: isQualityStaff,
  },
});

export const instrumentStatusAllows = {
  sendToCalibration: (i: Instrument) => i.status === "in-service",
  returnFromCalibration: (i: Instrument) => i.status === "in-calibration",
  recordCalibration: (i: Instrument) => i.status === "in-service",
};
