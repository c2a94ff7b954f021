import nodemailer from "nodemailer";
import { config } from "~/config.server";

// One SMTP transport per process: the mail catcher locally, the relay in production. Short
// timeouts: a relay that does not answer should fail fast (the sign-in page waits on it; the
// worker's mail jobs retry).
const transport = nodemailer.createTransport({
  url: config.mail.smtpUrl,
  connectionTimeout: 10_000,
  greetingTimeout: 10_000,
  socketTimeout: 30_000,
});

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export async function sendMail(mail: Mail) {
  await transport.sendMail({ from: config.mail.from, ...mail });
}
