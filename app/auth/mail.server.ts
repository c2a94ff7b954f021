import nodemailer from "nodemailer";
import { config } from "~/config.server";

// One SMTP transport per process: the mail catcher locally, the relay in production.
const transport = nodemailer.createTransport(config.mail.smtpUrl);

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export async function sendMail(mail: Mail) {
  await transport.sendMail({ from: config.mail.from, ...mail });
}
