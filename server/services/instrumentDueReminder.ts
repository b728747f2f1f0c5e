import { Op, type Transaction } from "sequelize";
import { CALIBRATION_REMINDER_DAYS, daysUntilDue, utcDay } from "../../shared/quality/instruments";
import type { Mailer } from "../jobs/mailer";
import { Instrument, User, recordEvent } from "../models";
import { calibrationDueMail } from "./mail-texts";

export { CALIBRATION_REMINDER_DAYS };

/**
 * Instruments in service whose calibration falls due within 14 days (or has already passed) get one
 * reminder mail per due date, addressed to the quality inspectors (the planners when there is none): the
 * stamp and the queued mails go in one transaction, so however often this runs, and in however many
 * processes, a due date is reminded once. A new due date (a new calibration) is a new occasion.
 */
export async function instrumentDueReminder(props: { mailer: Mailer; appUrl: string; transaction: Transaction; now?: Date; limit?: number }): Promise<number> {
  const { transaction } = props;
  const today = utcDay(props.now ?? new Date());
  const horizon = utcDay(new Date(Date.parse(`${today}T00:00:00Z`) + CALIBRATION_REMINDER_DAYS * 86_400_000));
  const due = await Instrument.findAll({
    where: {
      status: "in-service",
      calibrationDue: { [Op.lte]: horizon },
      [Op.or]: [{ reminderSentFor: null }, { reminderSentFor: { [Op.ne]: Instrument.sequelize!.col("calibration_due") } }],
    },
    order: [["calibrationDue", "ASC"]],
    limit: props.limit ?? 200,
    lock: transaction.LOCK.UPDATE,
    skipLocked: true,
    transaction,
  });
  if (!due.length) return 0;
  let people = await User.findAll({ where: { role: "qa", disabledAt: null }, attributes: ["id", "email", "name"], transaction });
  if (!people.length) people = await User.findAll({ where: { role: "admin", disabledAt: null }, attributes: ["id", "email", "name"], transaction });
  for (const instrument of due) {
    instrument.reminderSentFor = instrument.calibrationDue;
    await instrument.save({ transaction, fields: ["reminderSentFor"] });
    if (people.length) {
      await props.mailer.enqueue(
        calibrationDueMail({
          to: people.map((p) => p.email).join(", "), instrumentName: instrument.name, serialNumber: instrument.serialNumber, calibrationDue: instrument.calibrationDue,
          daysLeft: daysUntilDue(instrument, today), link: `${props.appUrl}/quality/instruments/${instrument.id}`,
        }),
        transaction,
      );
    }
    await recordEvent({ action: "instrument.reminder-sent", subject: { type: "instrument", id: instrument.id }, data: { calibrationDue: instrument.calibrationDue, recipients: people.length } }, transaction);
  }
  return due.length;
}
