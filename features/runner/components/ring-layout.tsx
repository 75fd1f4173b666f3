import type { ReactNode } from 'react';

/** The one big button beside the ring ("Clicked — bolt 7"): the control a gloved hand aims for. */
export const ringButtonClass =
  'min-h-24 w-full rounded-2xl bg-work px-4 text-2xl font-black text-white active:bg-work-dark';

/**
 * The bolt circle with its controls. Portrait: the ring above the buttons. Landscape (the phone
 * on its side): side by side, the ring as tall as the screen allows, so the bolt and the button
 * are in view together.
 */
export function RingLayout({ ring, children }: { ring: ReactNode; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-4 landscape:grid landscape:grid-cols-2 landscape:items-center">
      <div className="landscape:[&>svg]:max-h-[calc(100dvh-5rem)]">{ring}</div>
      {/* Portrait: the controls join the outer column, so a sticky control can rise over the ring. */}
      <div className="flex flex-col gap-4 portrait:contents">{children}</div>
    </div>
  );
}
