import 'server-only';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { env } from '@/server/env.mjs';

/** A message as the local sink stored it (see server/dev/mail-sink.ts). */
export type SinkMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  /** The shop the app tied the mail to (its X-Ringpass-Shop header); null when none. */
  shopId: string | null;
  /** Attached files' names, types and sizes (absent in mail stored before the sink kept them). */
  attachments?: { filename: string; contentType: string; size: number }[];
};

/**
 * The Mailbox exists only while mail goes to the local sink (MAILBOX_DIR set), and never on a
 * production server unless MAILBOX_DEMO=true says it is a demonstration: its invite links would
 * let anyone who reads them join a shop.
 */
export function mailboxEnabled(): boolean {
  const { MAILBOX_DIR, NODE_ENV, MAILBOX_DEMO } = env();
  return Boolean(MAILBOX_DIR) && (NODE_ENV !== 'production' || MAILBOX_DEMO === true);
}

/** A production server showing the Mailbox for a demo: the page says so in a banner. */
export function mailboxIsDemo(): boolean {
  return mailboxEnabled() && env().NODE_ENV === 'production';
}

const SCAN_LIMIT = 2000;

/** The newest mails the app tied to this shop, newest first. */
export async function listShopMail(shopId: string, limit = 100): Promise<SinkMessage[]> {
  const dir = env().MAILBOX_DIR;
  if (!dir) return [];
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  // File names sort by time (the sink names them so); read newest first until the page is full.
  names.sort().reverse();
  const found: SinkMessage[] = [];
  for (const name of names.slice(0, SCAN_LIMIT)) {
    const message = JSON.parse(
      await readFile(path.join(dir, name), 'utf8'),
    ) as Partial<SinkMessage>;
    if (message.shopId === shopId) found.push(message as SinkMessage);
    if (found.length >= limit) break;
  }
  return found;
}
