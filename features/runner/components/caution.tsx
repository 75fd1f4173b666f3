import { MAKER_FIRST } from '../steps';

/** The cautions of a step, shown where the work happens. */
export function Caution({ items }: { items: string[] }) {
  if (!items.length) return null;
  return (
    <aside
      aria-label="Caution"
      className="border-caution bg-caution-tint text-caution-ink rounded-xl border-l-8 p-3"
    >
      <p className="font-black tracking-wide">⚠ CAUTION</p>
      <ul className="ml-5 list-disc">
        {items.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
      <p className="mt-2 text-sm font-semibold">{MAKER_FIRST}</p>
    </aside>
  );
}
