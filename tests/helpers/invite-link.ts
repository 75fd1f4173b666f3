import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { invites } from '@/db/schema';
import type { SinkMessage } from '@/server/mail/mailbox';
import { inviteToken, waitForMail } from './mailbox';
import { INTEGRATION_SINK } from './test-services';

/**
 * The invite mailed to `to` and its link's token, once the worker that sent it has committed the
 * invite: the mail leaves inside the worker's transaction, a moment before the row takes the
 * token's hash, so a test that reads the mail and checks the link at once would race the commit.
 */
export async function deliveredInvite(
  to: string,
  timeoutMs = 5000,
): Promise<{ mail: SinkMessage; token: string }> {
  const mail = await waitForMail(INTEGRATION_SINK.dir, to, timeoutMs);
  const token = inviteToken(mail);
  const hash = createHash('sha256').update(token).digest('hex');
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if ((await getDb().$count(invites, eq(invites.tokenHash, hash))) > 0) return { mail, token };
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`the invite mailed to ${to} was never committed`);
}
