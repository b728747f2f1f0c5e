import { formatMoney } from "../../shared/schemas/documents";
import type { MailMessage } from "../jobs/mailer";

// The words of the mails the app sends. Plain text: it reads the same in every client.

export function invitationMail(p: { to: string; link: string; role: string; organizationName: string | null; invitedBy: string; expiresAt: Date }) {
  return {
    to: p.to,
    subject: "You are invited to Fluxwright",
    text: [
      `Hello,`,
      ``,
      `${p.invitedBy} has invited you to Fluxwright as ${p.role}${p.organizationName ? ` for ${p.organizationName}` : ""}.`,
      `Choose your name and password here:`,
      ``,
      p.link,
      ``,
      `The link works once and expires on ${p.expiresAt.toUTCString()}.`,
      `If you did not expect this, ignore this mail.`,
    ].join("\n"),
  };
}

export function passwordResetMail(p: { to: string; link: string; expiresAt: Date }) {
  return {
    to: p.to,
    subject: "Reset your Fluxwright password",
    text: [
      `Hello,`,
      ``,
      `Someone asked to reset the password of this Fluxwright account. To choose a new one, open:`,
      ``,
      p.link,
      ``,
      `The link works once and expires on ${p.expiresAt.toUTCString()}.`,
      `If it was not you, ignore this mail: your password stays as it is.`,
    ].join("\n"),
  };
}

export function welcomeMail(p: { to: string; name: string; organizationName: string; appUrl: string }) {
  return {
    to: p.to,
    subject: "Welcome to Fluxwright",
    text: [
      `Hello ${p.name},`,
      ``,
      `Your account for ${p.organizationName} is ready. Sign in at ${p.appUrl}/sign-in to check designs, get quotes and follow your orders.`,
    ].join("\n"),
  };
}

// --- ordering ---


const day = (d: Date) => d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

interface OrderMailBase {
  to: string;
  name: string;
  orderNumber: string;
  link: string;
}

export function orderReceivedMail(p: OrderMailBase & { quoteNumber: string; total_cents: number; currency: string; purchaseOrder: string | null }): MailMessage {
  return {
    to: p.to,
    subject: `Order ${p.orderNumber} received`,
    text: [
      `Hello ${p.name},`,
      ``,
      `Thank you: we have your order ${p.orderNumber} for quote ${p.quoteNumber}${p.purchaseOrder ? ` (your purchase order ${p.purchaseOrder})` : ""}.`,
      `Amount due: ${formatMoney(p.total_cents, p.currency)}. We start work once the payment has arrived; pay and follow the order here:`,
      ``,
      p.link,
      ``,
      `You can attach your drawings to the order on the same page.`,
    ].join("\n"),
  };
}

export function paymentReceivedMail(p: OrderMailBase & { amount_cents: number; currency: string; invoiceNumber: string; invoiceId: string; leadTime_workingDays: number }): MailMessage {
  return {
    to: p.to,
    subject: `Payment received for order ${p.orderNumber}: invoice ${p.invoiceNumber}`,
    text: [
      `Hello ${p.name},`,
      ``,
      `We have received ${formatMoney(p.amount_cents, p.currency)} for order ${p.orderNumber}. Invoice ${p.invoiceNumber} is attached.`,
      `Your order is now in the planning queue; the lead time is ${p.leadTime_workingDays} working days from today.`,
      ``,
      `Follow the order: ${p.link}`,
    ].join("\n"),
    attachments: [{ document: "invoice", id: p.invoiceId }],
  };
}

export function orderReleasedMail(p: OrderMailBase & { lots: string[] }): MailMessage {
  return {
    to: p.to,
    subject: `Order ${p.orderNumber} is in production`,
    text: [
      `Hello ${p.name},`,
      ``,
      `Order ${p.orderNumber} has been released to the shop floor${p.lots.length ? ` as lot${p.lots.length === 1 ? "" : "s"} ${p.lots.join(", ")}` : ""}.`,
      `Each lot is formed, hydrogen-annealed and measured before it ships with its certificate of conformance.`,
      ``,
      `Follow the order: ${p.link}`,
    ].join("\n"),
  };
}

export function orderShippedMail(p: OrderMailBase & { carrier?: string | null; trackingReference?: string | null }): MailMessage {
  return {
    to: p.to,
    subject: `Order ${p.orderNumber} has shipped`,
    text: [
      `Hello ${p.name},`,
      ``,
      `Order ${p.orderNumber} left the shop today${p.carrier ? ` with ${p.carrier}` : ""}${p.trackingReference ? ` (reference ${p.trackingReference})` : ""}.`,
      `Annealed shields lose permeability when bent, dropped or drilled: unpack them with care and keep them in their padding until they are fitted.`,
      `The lots' certificates are on the order page: ${p.link}`,
    ].join("\n"),
  };
}

export function quoteExpiringMail(p: { to: string; name: string; quoteNumber: string; expiresAt: Date; total_cents: number; currency: string; link: string }): MailMessage {
  return {
    to: p.to,
    subject: `Quote ${p.quoteNumber} expires on ${day(p.expiresAt)}`,
    text: [
      `Hello ${p.name},`,
      ``,
      `Your quote ${p.quoteNumber} (${formatMoney(p.total_cents, p.currency)}) holds its price until ${day(p.expiresAt)}.`,
      `To order at this price, place the order before then:`,
      ``,
      p.link,
      ``,
      `After that date you can ask for a new quote at the rates of the day from the same page.`,
    ].join("\n"),
  };
}

export function refundIssuedMail(p: OrderMailBase & { amount_cents: number; currency: string; reason: string }): MailMessage {
  return {
    to: p.to,
    subject: `Refund for order ${p.orderNumber}`,
    text: [
      `Hello ${p.name},`,
      ``,
      `We have refunded ${formatMoney(p.amount_cents, p.currency)} of order ${p.orderNumber} to the card it was paid with.`,
      `Reason: ${p.reason}`,
      `Card refunds usually reach the account within a few working days.`,
      ``,
      `The order: ${p.link}`,
    ].join("\n"),
  };
}

// --- quality ---

export function calibrationDueMail(p: { to: string; instrumentName: string; serialNumber: string | null; calibrationDue: string; daysLeft: number; link: string }): MailMessage {
  const when = day(new Date(`${p.calibrationDue}T00:00:00Z`));
  const overdue = p.daysLeft < 0;
  return {
    to: p.to,
    subject: overdue ? `Calibration of ${p.instrumentName} was due on ${when}` : `Calibration of ${p.instrumentName} is due on ${when}`,
    text: [
      `Hello,`,
      ``,
      overdue
        ? `The calibration of ${p.instrumentName}${p.serialNumber ? ` (serial ${p.serialNumber})` : ""} was due on ${when}. It may not be used for measurements until it has been calibrated again.`
        : `The calibration of ${p.instrumentName}${p.serialNumber ? ` (serial ${p.serialNumber})` : ""} is due on ${when}, in ${p.daysLeft} day${p.daysLeft === 1 ? "" : "s"}. After that day it may not be used for measurements until it has been calibrated again.`,
      overdue ? `Send it out for calibration now, and record its new certificate when it is back:` : `Send it out in time, and record its new certificate when it is back:`,
      ``,
      p.link,
    ].join("\n"),
  };
}

/** To the owner of an address someone tried to register again: no account is made, nobody is signed in. */
export function registrationAttemptMail(p: { to: string; appUrl: string }) {
  return {
    to: p.to,
    subject: "Someone tried to create a Fluxwright account with your address",
    text: [
      `Hello,`,
      ``,
      `Someone tried to create a new Fluxwright account with this address, which already has one. No new account was made and nothing about your account changed.`,
      ``,
      `If it was you, sign in at ${p.appUrl}/sign-in, or choose a new password at ${p.appUrl}/forgot-password.`,
      `If it was not you, you can ignore this mail.`,
    ].join("\n"),
  };
}
