import type { Anomaly } from './types';

export type Accepted = { anomaly: Anomaly; reason: string };

/**
 * Matches the lead's reasons to the blocking anomalies as computed now: every one needs a reason;
 * reasons for anomalies that no longer exist (or only note) are ignored.
 */
export function matchAcknowledgements(
  anomalies: readonly Anomaly[],
  acks: readonly { key: string; reason: string }[],
): { accepted: Accepted[]; missing: Anomaly[] } {
  const reasons = new Map(acks.map((a) => [a.key, a.reason.trim()]));
  const blocking = anomalies.filter((a) => a.severity === 'blocks');
  return {
    accepted: blocking
      .filter((a) => reasons.get(a.key))
      .map((anomaly) => ({ anomaly, reason: reasons.get(anomaly.key)! })),
    missing: blocking.filter((a) => !reasons.get(a.key)),
  };
}

/** The sign-off's note in the job's history: the lead's own words, then each acknowledged anomaly with its reason. */
export function signoffNote(note: string, accepted: readonly Accepted[]): string {
  const lines = accepted.map(
    ({ anomaly, reason }) => `Acknowledged: ${anomaly.message} Reason: ${reason}`,
  );
  return [note.trim(), ...lines].filter(Boolean).join('\n');
}

/** The send-back's note for the job's history: each wheel with what to redo. */
export function sendBackNote(wheels: readonly { position: string; note: string }[]): string {
  return wheels.map((w) => `${w.position}: ${w.note.trim()}`).join('\n');
}
