import 'server-only';
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { anomalyAcknowledgements, users } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError } from '@/server/errors';
import { matchAcknowledgements, signoffNote } from '../acknowledge';
import type { ApproveInput } from '../schemas';
import { getJobReview, type ReviewSources } from './review-data';

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

/**
 * Signs a job off after its review: the anomalies are computed again now, every blocking one
 * must carry the lead's reason, and the reasons are stored in the same transaction as the move
 * (`transition`, the jobs feature's own path with its rules), so a sign-off never lands without
 * them. The note the move records lists them for the job's history.
 */
export async function signOffReviewed(
  member: Member,
  input: ApproveInput,
  sources: ReviewSources,
  transition: (tx: Tx, note: string) => Promise<unknown>,
) {
  const review = await getJobReview(member.shopId, input.jobId, sources);
  const { accepted, missing } = matchAcknowledgements(review.anomalies, input.acknowledgements);
  if (missing.length) {
    const message = 'Acknowledge every anomaly that blocks sign-off with a reason first.';
    throw new DomainError(
      'invalid',
      message,
      Object.fromEntries(
        missing.map((a) => [
          `acknowledgements.${a.key}`,
          ['Say why this is acceptable before signing off.'],
        ]),
      ),
    );
  }
  const at = new Date();
  await getDb().transaction(async (tx) => {
    await transition(tx, signoffNote(input.note, accepted));
    if (accepted.length) {
      await tx.insert(anomalyAcknowledgements).values(
        accepted.map(({ anomaly, reason }) => ({
          shopId: member.shopId,
          jobId: input.jobId,
          wheelId: anomaly.wheelId,
          anomalyKey: anomaly.key,
          code: anomaly.code,
          message: anomaly.message,
          reason,
          byId: member.userId,
          at,
        })),
      );
    }
  });
  return { acknowledged: accepted.length };
}

export type Acknowledgement = { message: string; reason: string; by: string; at: string };

/** Every acknowledgement on the job, oldest first, with who gave it. */
export async function listAcknowledgements(
  shopId: string,
  jobId: string,
): Promise<Acknowledgement[]> {
  const rows = await getDb()
    .select({
      message: anomalyAcknowledgements.message,
      reason: anomalyAcknowledgements.reason,
      by: users.name,
      at: anomalyAcknowledgements.at,
    })
    .from(anomalyAcknowledgements)
    .innerJoin(users, eq(users.id, anomalyAcknowledgements.byId))
    .where(
      and(eq(anomalyAcknowledgements.shopId, shopId), eq(anomalyAcknowledgements.jobId, jobId)),
    )
    .orderBy(asc(anomalyAcknowledgements.at));
  return rows.map((r) => ({ ...r, at: r.at.toISOString() }));
}
