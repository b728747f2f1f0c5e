import { describe, expect, it } from "vitest";
import { orderReleasedMail, orderShippedMail, paymentReceivedMail, quoteExpiringMail } from "../../server/services/mail-texts";

const base = { to: "ada@example.test", name: "Ada", orderNumber: "O-1042", link: "http://127.0.0.1:4100/orders/x" };

describe("order mails", () => {
  it("payment received carries the invoice as an attachment reference, rendered when the mail goes out", () => {
    const m = paymentReceivedMail({ ...base, amount_cents: 123456, currency: "EUR", invoiceNumber: "INV-1001", invoiceId: "inv-1", leadTime_workingDays: 20 });
    expect(m.subject).toBe("Payment received for order O-1042: invoice INV-1001");
    expect(m.text).toContain("€1,234.56");
    expect(m.attachments).toEqual([{ document: "invoice", id: "inv-1" }]);
  });
  it("released and shipped name the order, its lots and the handling caution", () => {
    expect(orderReleasedMail({ ...base, lots: ["L-1", "L-2"] }).text).toContain("as lots L-1, L-2");
    const shipped = orderShippedMail({ ...base, carrier: "Parcel Co", trackingReference: "TR-9" });
    expect(shipped.subject).toBe("Order O-1042 has shipped");
    expect(shipped.text).toMatch(/lose permeability when bent, dropped or drilled/);
    expect(shipped.text).toContain(base.link);
  });
  it("quote expiring gives the date and the way to order", () => {
    const m = quoteExpiringMail({ to: "a@b.test", name: "Ada", quoteNumber: "Q-7", expiresAt: new Date("2026-03-04T10:00:00Z"), total_cents: 5000, currency: "EUR", link: "http://x/quotes/7" });
    expect(m.subject).toBe("Quote Q-7 expires on 4 March 2026");
    expect(m.text).toContain("http://x/quotes/7");
  });
});
