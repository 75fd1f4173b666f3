import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/server/env.mjs';

export type OutgoingMail = { to: string; subject: string; text: string; html: string };

// SMTP_URL points at the local sink in development and tests and at the real relay in
// production; the code path is the same.
let transport: Transporter | undefined;
function getTransport() {
  transport ??= nodemailer.createTransport(env().SMTP_URL);
  return transport;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await getTransport().sendMail({ from: env().MAIL_FROM, ...mail });
}
