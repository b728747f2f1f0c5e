// The hosted checkout page of the stand-in: plain, clearly local, usable with a keyboard and a
// screen reader. It looks like no real payment page on purpose.

export interface PageSession {
  id: string;
  status: "open" | "complete" | "expired";
  payment_status: "unpaid" | "paid";
  amount_total: number;
  currency: string;
  items: Array<{ name: string; description: string | null; quantity: number; unit_amount: number }>;
  success_url: string;
  cancel_url: string | null;
  customer_email: string | null;
}

export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
const money = (cents: number, currency: string) => new Intl.NumberFormat("en-GB", { style: "currency", currency: currency.toUpperCase() }).format(cents / 100);

export function checkoutPage(s: PageSession, notice?: { tone: "declined" | "info"; text: string }): string {
  const rows = s.items
    .map((i) => `<tr><td>${escapeHtml(i.name)}${i.description ? `<br><span class="muted">${escapeHtml(i.description)}</span>` : ""}</td><td class="num">${i.quantity}</td><td class="num">${money(i.unit_amount, s.currency)}</td><td class="num">${money(i.unit_amount * i.quantity, s.currency)}</td></tr>`)
    .join("");
  const total = money(s.amount_total, s.currency);
  let body: string;
  if (s.status === "complete") {
    body = `<p class="notice ok" role="status">Paid: ${total}. The shop has been told.</p><p><a class="button" href="${escapeHtml(s.success_url)}">Back to the shop</a></p>`;
  } else if (s.status === "expired") {
    body = `<p class="notice" role="status">This checkout has expired; nothing was charged. Start the payment again from the shop.</p>${s.cancel_url ? `<p><a href="${escapeHtml(s.cancel_url)}">Back to the shop</a></p>` : ""}`;
  } else {
    body = `${notice ? `<p class="notice ${notice.tone === "declined" ? "bad" : ""}" role="alert">${escapeHtml(notice.text)}</p>` : ""}
<form method="post" action="/checkout/${encodeURIComponent(s.id)}/pay">
  <fieldset>
    <legend>Choose what the test card does</legend>
    <p class="muted">No card number is needed: this page only pretends to charge one.</p>
    <div class="buttons">
      <button type="submit" name="outcome" value="succeeded" class="pay">Pay ${total}</button>
      <button type="submit" name="outcome" value="declined">Decline the card</button>
    </div>
  </fieldset>
</form>
${s.cancel_url ? `<p><a href="${escapeHtml(s.cancel_url)}">Back to the shop without paying</a></p>` : ""}`;
  }
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Payment stand-in: ${total}</title>
<style>
body{font:16px/1.5 system-ui,sans-serif;margin:0;background:#f2f2f2;color:#1a1a1a}
main{max-width:640px;margin:0 auto;padding:24px 16px}
.banner{border:2px dashed #555;background:#fff;padding:10px 14px;margin:0 0 20px;font-weight:600}
h1{font-size:24px;margin:0 0 4px} .amount{font-size:32px;font-weight:700;margin:8px 0 16px}
table{width:100%;border-collapse:collapse;background:#fff;margin:0 0 20px} th,td{text-align:left;padding:8px;border-bottom:1px solid #ccc;vertical-align:top}
.num{text-align:right;white-space:nowrap} .muted{color:#555;font-size:14px}
fieldset{border:1px solid #999;background:#fff;padding:12px 16px;margin:0 0 16px} legend{font-weight:600;padding:0 4px}
.buttons{display:flex;flex-wrap:wrap;gap:12px}
button,.button{font:inherit;font-weight:600;padding:10px 18px;border:2px solid #1a1a1a;border-radius:4px;background:#fff;color:#1a1a1a;cursor:pointer;text-decoration:none;display:inline-block}
button.pay{background:#1a1a1a;color:#fff}
button:focus-visible,a:focus-visible{outline:3px solid #0b57d0;outline-offset:2px}
a{color:#0b4fa8}
.notice{padding:10px 14px;border-left:6px solid #555;background:#fff} .notice.bad{border-color:#a00000;color:#6b0000} .notice.ok{border-color:#1d6b35;color:#0f3d1e}
</style></head>
<body><main>
<p class="banner">Local payment stand-in. No money moves and no card is charged; it only tells the shop's application what happened.</p>
<h1>Checkout ${escapeHtml(s.id.slice(-8))}</h1>
${s.customer_email ? `<p class="muted">For ${escapeHtml(s.customer_email)}</p>` : ""}
<p class="amount">${total}</p>
<table><caption class="muted" style="text-align:left;caption-side:top;padding:0 0 6px">What you are paying for</caption>
<thead><tr><th scope="col">Item</th><th scope="col" class="num">Quantity</th><th scope="col" class="num">Each</th><th scope="col" class="num">Amount</th></tr></thead>
<tbody>${rows}</tbody></table>
${body}
</main></body></html>`;
}
