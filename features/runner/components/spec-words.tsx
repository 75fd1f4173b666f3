/** The spec's own words (maker reference, notes, thread condition, bolt reuse) where the bolts go in. */
export type SpecWords = {
  makerReference: string;
  notes: string;
  threadCondition?: string | null;
  boltReuse?: string | null;
};

export function SpecWordsBox({ words }: { words: SpecWords | undefined }) {
  if (!words) return null;
  const rows = [
    ['Thread condition', words.threadCondition],
    ['Bolt reuse', words.boltReuse],
    ["Maker's reference", words.makerReference],
    ['Spec notes', words.notes],
  ].filter((r): r is [string, string] => Boolean(r[1]?.trim()));
  if (!rows.length) return null;
  return (
    <section aria-label="From the wheel spec" className="border-ink-soft rounded-xl border-2 p-3">
      <p className="font-black">From the wheel spec</p>
      <dl className="mt-1 grid gap-1">
        {rows.map(([k, v]) => (
          <div key={k}>
            <dt className="inline font-semibold">{k}: </dt>
            <dd className="inline whitespace-pre-line">{v}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
