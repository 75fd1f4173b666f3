import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { SinkMessage } from '@/server/mail/mailbox';

/** Waits for the sink to hold a message to `to` and returns the newest. */
export async function waitForMail(dir: string, to: string, timeoutMs = 5000): Promise<SinkMessage> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    let names: string[] = [];
    try {
      names = readdirSync(dir)
        .filter((n) => n.endsWith('.json'))
        .sort()
        .reverse();
    } catch {}
    for (const n of names) {
      const m = JSON.parse(readFileSync(path.join(dir, n), 'utf8')) as SinkMessage;
      if (m.to.includes(to)) return m;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}

export const inviteToken = (m: SinkMessage) => /\/invite\/([A-Za-z0-9_-]+)/.exec(m.text)?.[1] ?? '';
