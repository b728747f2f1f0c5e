// A local stand-in for a mail relay: accepts SMTP on loopback, keeps what it receives in memory,
// and shows it on an inbox page and as JSON. It imports nothing of the application.
import { createServer, type Server } from "node:http";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface StoredMessage {
  id: string;
  to: string[];
  from: string;
  subject: string;
  text: string;
  date: string;
  attachments: { filename: string; contentType: string; size: number }[];
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((x) => x.value.map((v) => v.address ?? "")).filter(Boolean);

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
const linkify = (s: string) => escapeHtml(s).replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

function inboxPage(messages: StoredMessage[]): string {
  const rows = messages
    .slice()
    .reverse()
    .map(
      (m) => `<article><header><h2>${escapeHtml(m.subject || "(no subject)")}</h2>
<p class="meta">to ${escapeHtml(m.to.join(", "))} · from ${escapeHtml(m.from)} · ${escapeHtml(new Date(m.date).toLocaleString("en-GB"))}</p></header>
<pre>${linkify(m.text)}</pre>${m.attachments.length ? `<p class="meta">attachments: ${m.attachments.map((a) => escapeHtml(`${a.filename} (${a.contentType})`)).join(", ")}</p>` : ""}</article>`,
    )
    .join("\n");
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Mail stand-in inbox</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>body{font:16px/1.5 system-ui,sans-serif;margin:0;background:#f4f4f0;color:#1d232b}main{max-width:880px;margin:0 auto;padding:24px}
h1{font-size:22px}article{background:#fff;border:1px solid #d5d7d2;border-radius:8px;padding:16px 20px;margin:0 0 16px}
h2{font-size:18px;margin:0}.meta{color:#5a6270;font-size:14px;margin:4px 0}pre{white-space:pre-wrap;font:15px/1.5 ui-monospace,monospace}
form{display:block;margin:0 0 16px}button{font:inherit;padding:6px 12px}</style></head>
<body><main><h1>Mail stand-in: ${messages.length} message${messages.length === 1 ? "" : "s"}</h1>
<p class="meta">Every mail the application sends on this machine lands here; nothing leaves it. <a href="/api/messages">JSON</a></p>
<form method="post" action="/api/messages/clear"><button>Empty the inbox</button></form>
${rows || "<p>No mail yet.</p>"}</main></body></html>`;
}

export interface MailStandIn {
  smtpPort: number;
  webPort: number;
  messages: StoredMessage[];
  close(): Promise<void>;
}

export async function startMailStandIn(opts: { smtpPort: number; webPort: number; host?: string }): Promise<MailStandIn> {
  const host = opts.host ?? "127.0.0.1";
  const messages: StoredMessage[] = [];
  let counter = 0;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) => {
          messages.push({
            id: String(++counter),
            to: addresses(mail.to),
            from: addresses(mail.from)[0] ?? "",
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            date: (mail.date ?? new Date()).toISOString(),
            attachments: mail.attachments.map((a) => ({ filename: a.filename ?? "attachment", contentType: a.contentType, size: a.size })),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  const web: Server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://localhost");
    if (req.method === "GET" && url.pathname === "/api/messages") {
      const to = url.searchParams.get("to");
      const list = to ? messages.filter((m) => m.to.includes(to.toLowerCase())) : messages;
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(list));
    } else if ((req.method === "DELETE" && url.pathname === "/api/messages") || (req.method === "POST" && url.pathname === "/api/messages/clear")) {
      messages.length = 0;
      if (req.method === "POST") res.writeHead(303, { location: "/" }).end();
      else res.writeHead(204).end();
    } else if (url.pathname === "/favicon.ico") {
      res.writeHead(204).end();
    } else if (req.method === "GET" && url.pathname === "/") {
      res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(inboxPage(messages));
    } else {
      res.writeHead(404, { "content-type": "application/json" }).end(JSON.stringify({ error: { code: "NOT_FOUND", message: "no such page" } }));
    }
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(opts.smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    web.once("error", reject);
    web.listen(opts.webPort, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as { port: number }).port;
  const webPort = (web.address() as { port: number }).port;
  return {
    smtpPort,
    webPort,
    messages,
    close: () => Promise.all([new Promise<void>((r) => smtp.close(() => r())), new Promise<void>((r) => web.close(() => r()))]).then(() => {}),
  };
}
