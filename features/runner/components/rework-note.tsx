/** A lead sent this wheel back: what they said, first thing on the screen. */
export function ReworkNote({ note, steps }: { note: string; steps: string[] }) {
  return (
    <section
      role="alert"
      aria-label="Sent back by the lead"
      className="border-caution bg-caution-tint rounded-xl border-4 p-4"
    >
      <p className="text-xl font-black">Sent back by the lead</p>
      <p className="mt-1 text-lg whitespace-pre-wrap">{note}</p>
      <p className="mt-2 font-semibold">
        {steps.length ? `Redo: ${steps.join(', ')}.` : 'Redo the whole wheel.'} Everything recorded
        before stays in the history.
      </p>
    </section>
  );
}
