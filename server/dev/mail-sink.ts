/**
 * A local SMTP sink for development and tests: accepts every message on 127.0.0.1 and stores it
 * as JSON in a folder that the development-only Mailbox page reads (each lead sees the mails whose
 * X-Ringpass-Shop header names their shop). Runs as part of the start script and the test setup;
 * the app talks to it through nodemailer exactly as to a real relay.
 * (server/dev/ holds processes, not app modules, so these files do not import 'server-only'.)
 */
import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

// Lower case: mailparser keys its header map so. Same value as SHOP_HEADER in server/mail/mailer.ts.
const SHOP_HEADER = 'x-ringpass-shop';
const shopOf = (value: unknown) =>
  typeof value === 'string' && /^[0-9a-f-]{36}$/i.test(value.trim()) ? value.trim() : null;

export type MailSink = { port: number; close: () => Promise<void> };

/**
 * `onUnowned` hears of mail tied to no shop (a sign-up link): no Mailbox shows it, so the start
 * script prints it, and whoever is trying the demo can still finish signing up.
 */
export async function startMailSink(options: {
  port: number;
  dir: string;
  onUnowned?: (mail: { to: string[]; subject: string; text: string }) => void;
}): Promise<MailSink> {
  mkdirSync(options.dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const receivedAt = new Date().toISOString();
          const id = randomUUID();
          const record = {
            id,
            receivedAt,
            from: mail.from?.text ?? session.envelope.mailFrom?.toString() ?? '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            shopId: shopOf(mail.headers.get(SHOP_HEADER)),
            // What is attached, not the bytes: enough to see the customer's report went with its mail.
            attachments: mail.attachments.map((a) => ({
              filename: a.filename ?? '',
              contentType: a.contentType,
              size: a.size,
            })),
          };
          // Name sorts by time so the Mailbox can list newest first without reading every file.
          const name = `${receivedAt.replace(/[:.]/g, '-')}-${id}.json`;
          // Written aside and renamed into place: a reader (the Mailbox page, a test) listing the
          // folder meanwhile never opens a half-written message.
          const file = path.join(options.dir, name);
          writeFileSync(`${file}.part`, JSON.stringify(record, null, 2));
          renameSync(`${file}.part`, file);
          if (!record.shopId) options.onUnowned?.(record);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  return {
    port: options.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
