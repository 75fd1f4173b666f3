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
};

/** The Mailbox exists only while mail goes to the local sink (MAILBOX_DIR set). */
export function mailboxEnabled(): boolean {
  return Boolean(env().MAILBOX_DIR);
}

export async function listSinkMessages(limit = 100): Promise<SinkMessage[]> {
  const dir = env().MAILBOX_DIR;
  if (!dir) return [];
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  names.sort().reverse();
  const messages = await Promise.all(
    names.slice(0, limit).map(async (n) => JSON.parse(await readFile(path.join(dir, n), 'utf8')) as SinkMessage),
  );
  return messages;
}
