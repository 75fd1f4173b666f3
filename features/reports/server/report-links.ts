import 'server-only';
import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase64urlNoPadding, encodeHexLowerCase } from '@oslojs/encoding';
import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobs, reportLinks } from '@/db/schema';
import { DomainError, notFound } from '@/server/errors';

/** 32 random bytes: 256 bits, far past guessing; base64url of them is 43 characters. */
const TOKEN_BYTES = 32;
const TOKEN_SHAPE = /^[A-Za-z0-9_-]{43}$/;
export const LINK_DAYS = 90;
const DAY_MS = 86_400_000;

/** What the database keeps of a token: its SHA-256, so a copy of the table opens no report. */
export function tokenHashOf(token: string): string | null {
  if (!TOKEN_SHAPE.test(token)) return null;
  return encodeHexLowerCase(sha256(new TextEncoder().encode(token)));
}

async function assertSignedOff(shopId: string, jobId: string) {
  const [job] = await getDb()
    .select({ state: jobs.state })
    .from(jobs)
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('That job card');
  if (job.state !== 'signed_off')
    throw new DomainError('conflict', 'A customer link can be made once the job is signed off.');
}

/** A new link to the job's report; the raw token is returned this once and never stored. */
export async function createReportLink(
  shopId: string,
  jobId: string,
  byId: string,
  now = new Date(),
): Promise<{ id: string; token: string; expiresAt: Date }> {
  await assertSignedOff(shopId, jobId);
  const bytes = new Uint8Array(TOKEN_BYTES);
  crypto.getRandomValues(bytes);
  const token = encodeBase64urlNoPadding(bytes);
  const expiresAt = new Date(now.getTime() + LINK_DAYS * DAY_MS);
  const [row] = await getDb()
    .insert(reportLinks)
    .values({ shopId, jobId, tokenHash: tokenHashOf(token)!, createdById: byId, expiresAt })
    .returning({ id: reportLinks.id });
  return { id: row!.id, token, expiresAt };
}

/** A lead withdraws a link: from then on it opens nothing. Another shop's link is not found. */
export async function revokeReportLink(shopId: string, linkId: string, byId: string) {
  const [row] = await getDb()
    .update(reportLinks)
    .set({ revokedAt: new Date(), revokedById: byId })
    .where(
      and(
        eq(reportLinks.shopId, shopId),
        eq(reportLinks.id, linkId),
        isNull(reportLinks.revokedAt),
      ),
    )
    .returning({ id: reportLinks.id, jobId: reportLinks.jobId });
  if (!row) throw notFound('That customer link');
  return row;
}

/** The links of a job that still open its report, newest first. */
export async function listActiveReportLinks(shopId: string, jobId: string, now = new Date()) {
  return getDb()
    .select({
      id: reportLinks.id,
      createdAt: reportLinks.createdAt,
      expiresAt: reportLinks.expiresAt,
    })
    .from(reportLinks)
    .where(
      and(
        eq(reportLinks.shopId, shopId),
        eq(reportLinks.jobId, jobId),
        isNull(reportLinks.revokedAt),
        gt(reportLinks.expiresAt, now),
      ),
    )
    .orderBy(desc(reportLinks.createdAt));
}

/**
 * The one job a token opens: a well-formed token whose hash is stored, not expired, not revoked,
 * on a job still signed off. Anything else is null, and every caller answers it with one plain 404.
 */
export async function findReportLink(
  token: string,
  now = new Date(),
): Promise<{ shopId: string; jobId: string } | null> {
  const hash = tokenHashOf(token);
  if (!hash) return null;
  const [row] = await getDb()
    .select({ shopId: reportLinks.shopId, jobId: reportLinks.jobId })
    .from(reportLinks)
    .innerJoin(jobs, and(eq(jobs.id, reportLinks.jobId), eq(jobs.shopId, reportLinks.shopId)))
    .where(
      and(
        eq(reportLinks.tokenHash, hash),
        isNull(reportLinks.revokedAt),
        gt(reportLinks.expiresAt, now),
        eq(jobs.state, 'signed_off'),
      ),
    );
  return row ?? null;
}

export function reportLinkUrl(appUrl: string, token: string): string {
  return `${new URL(appUrl).origin}/r/${token}`;
}
