import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/server/env.mjs';

/** The header that ties a mail to its shop, so the development Mailbox shows a lead only their own. */
export const SHOP_HEADER = 'X-Ringpass-Shop';

/**
 * Every mail names the shop it concerns: an invite its inviting shop, a notice about an account
 * that account's shop. `null` only for mail that concerns no shop; the Mailbox shows it nowhere.
 */
export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html: string;
  shopId: string | null;
  /** Files sent with the mail (the customer's report PDF). */
  attachments?: { filename: string; content: Buffer; contentType: string }[];
};

// SMTP_URL points at the local sink in development and tests and at the real relay in
// production; the code path is the same.
let transport: Transporter | undefined;
function getTransport() {
  transport ??= nodemailer.createTransport(env().SMTP_URL);
  return transport;
}

export async function sendMail({ shopId, ...mail }: OutgoingMail): Promise<void> {
  await getTransport().sendMail({
    from: env().MAIL_FROM,
    ...mail,
    headers: shopId ? { [SHOP_HEADER]: shopId } : {},
  });
}
