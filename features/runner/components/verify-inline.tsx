'use client';

import { useState } from 'react';
import {
  UNIT_LABELS,
  type RecordedVerification,
  type Torque,
  type Wrench,
} from '@/features/torque-plan';

type Saved = RecordedVerification & { withinTolerance: boolean };

/**
 * The runner's on-the-spot verification: before a pass, the wrench needs a verification that
 * counts under the shop's policy. The reference starts at the pass's own setting, the point that
 * matters for this pass; the technician types what the tester shows.
 */
export function VerifyInline({
  wrench,
  setting,
  why,
  onResult,
}: {
  wrench: Wrench & { label: string };
  /** The setting this pass uses, in the wrench's unit: proposed as the reference. */
  setting: Torque;
  /** Why the wrench's earlier verifications do not count for this pass. */
  why: string;
  onResult: (saved: Saved) => void;
}) {
  const [reference, setReference] = useState(String(setting.value));
  const [reading, setReading] = useState('');
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  // A new pass (or another wrench's unit) proposes its own setting; the last result stays in view.
  const proposed = `${wrench.id} ${setting.value} ${setting.unit}`;
  const [shownFor, setShownFor] = useState(proposed);
  if (shownFor !== proposed) {
    setShownFor(proposed);
    setReference(String(setting.value));
    setReading('');
  }

  async function submit() {
    setBusy(true);
    try {
      const referenceValue = Number(reference);
      const res = await fetch(`/api/wrenches/${wrench.id}/verifications`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ referenceValue, readingValue: Number(reading), unit: wrench.unit }),
      });
      const body = (await res.json()) as {
        data?: {
          recordedAt: string;
          withinTolerance: boolean;
          deviationPct: number;
          tolerancePct: number;
        };
        error?: { message: string };
      };
      if (!res.ok || !body.data)
        return setMessage({
          ok: false,
          text: body.error?.message ?? 'The verification was not saved.',
        });
      const d = body.data;
      setMessage({
        ok: d.withinTolerance,
        text: d.withinTolerance
          ? `Within tolerance (${d.deviationPct.toFixed(1)} %).`
          : `Out of tolerance (${d.deviationPct.toFixed(1)} %, allowed ±${d.tolerancePct} %): the wrench is out of service. Pick another.`,
      });
      onResult({
        wrenchId: wrench.id,
        recordedAt: d.recordedAt,
        referenceValue,
        unit: wrench.unit,
        withinTolerance: d.withinTolerance,
      });
    } catch {
      setMessage({
        ok: false,
        text: 'No connection: a verification has to reach the server. Try again when the Wi-Fi is back.',
      });
    } finally {
      setBusy(false);
    }
  }

  const unit = UNIT_LABELS[wrench.unit];
  return (
    <section
      aria-label="Verify the wrench"
      className="border-caution flex flex-col gap-3 rounded-xl border-2 p-3"
    >
      <p className="font-bold">
        Check {wrench.label} on the tester before this pass. {why}
      </p>
      <p className="text-sm">
        The reference is this pass&apos;s setting, {setting.value} {unit}; change it to what the
        tester is set to.
      </p>
      <div className="grid grid-cols-2 gap-2">
        <label className="flex min-w-0 flex-col gap-1 font-semibold">
          Reference ({unit})
          <input
            inputMode="decimal"
            value={reference}
            onChange={(e) => setReference(e.target.value)}
            className="border-ink-soft min-h-14 min-w-0 rounded-xl border-2 px-3 text-lg"
          />
        </label>
        <label className="flex min-w-0 flex-col gap-1 font-semibold">
          Reading ({unit})
          <input
            inputMode="decimal"
            value={reading}
            onChange={(e) => setReading(e.target.value)}
            className="border-ink-soft min-h-14 min-w-0 rounded-xl border-2 px-3 text-lg"
          />
        </label>
      </div>
      {message ? (
        <p
          role={message.ok ? 'status' : 'alert'}
          className={message.ok ? 'text-ok font-bold' : 'text-danger font-bold'}
        >
          {message.text}
        </p>
      ) : null}
      <button
        type="button"
        disabled={busy || !Number(reference) || !Number(reading)}
        onClick={() => void submit()}
        className="bg-work min-h-16 rounded-xl px-4 text-lg font-bold text-white disabled:opacity-40"
      >
        Record verification
      </button>
    </section>
  );
}

/**
 * The same stop for someone who may not record a verification (an apprentice): the pass waits
 * for a lead or technician to check the wrench; once the check is recorded, reload to go on.
 */
export function VerifyAskOthers({ wrench, why }: { wrench: { label: string }; why: string }) {
  return (
    <section
      aria-label="Verify the wrench"
      className="border-caution flex flex-col gap-2 rounded-xl border-2 p-3"
    >
      <p role="alert" className="font-bold">
        This wrench needs a check before this pass — ask a lead or technician to verify it.
      </p>
      <p>
        {wrench.label}: {why} Don&apos;t pull on a bolt with it until the check is recorded; then
        reload this page to carry on.
      </p>
    </section>
  );
}
