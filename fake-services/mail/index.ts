// `node --import tsx fake-services/mail/index.ts` — SMTP on $SMTP_PORT (4125), inbox on $MAIL_WEB_PORT (4126).
import { startMailStandIn } from "./server";

const mail = await startMailStandIn({ smtpPort: Number(process.env.SMTP_PORT ?? 4125), webPort: Number(process.env.MAIL_WEB_PORT ?? 4126) });
console.log(`mail stand-in: SMTP 127.0.0.1:${mail.smtpPort}, inbox http://127.0.0.1:${mail.webPort}`);
let stopping = false;
const stop = () => {
  if (stopping) return; // Ctrl-C may arrive from the terminal and from npm start's clean-up
  stopping = true;
  void mail.close().then(() => process.exit(0));
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
