import type { ReportView } from '../view-model';
import type { WheelView } from '../wheel-view';

function Row({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex flex-col py-1 sm:flex-row sm:gap-2">
      <dt className="text-sm text-slate-600 sm:w-40 sm:shrink-0">{label}</dt>
      <dd className="font-medium">{value}</dd>
    </div>
  );
}

function WheelCard({ wheel, base }: { wheel: WheelView; base: string }) {
  return (
    <section
      className="rounded-lg border border-slate-300 p-4"
      aria-label={`${wheel.position} wheel`}
    >
      <h2 className="text-lg font-bold">
        {wheel.position} · {wheel.positionName}
      </h2>
      <dl className="mt-2">
        <Row label="Tire" value={`${wheel.tireSize}. ${wheel.direction}`} />
        {wheel.spec ? (
          <>
            <Row label="Ring bolts" value={`${wheel.spec.boltCount} × ${wheel.spec.boltThread}`} />
            <Row label="Final torque" value={wheel.spec.finalTorque} />
            <Row label="Threads" value={wheel.spec.threadCondition} />
          </>
        ) : null}
        <Row label="Bead seated at" value={wheel.beadSeatUsed ?? 'not recorded'} />
        <Row label="Pressure set" value={wheel.pressureSet ?? 'not recorded'} />
        <Row label="Work by" value={wheel.workedBy.join(', ') || 'not recorded'} />
      </dl>
      <h3 className="mt-3 font-semibold">Torque passes</h3>
      <ul className="mt-1 space-y-2 text-sm">
        {wheel.passes.map((p) => (
          <li key={p.index}>
            <span className="font-medium">{p.kind}</span>, target {p.target}
            {p.wrenches.map((w) => (
              <span key={`${w.label}${w.setting}`} className="block text-slate-700">
                {w.label} ({w.serial}) set to {w.setting}, last verified {w.lastVerification}
              </span>
            ))}
          </li>
        ))}
      </ul>
      {wheel.photos.length ? (
        <div className="mt-3 grid grid-cols-2 gap-2">
          {wheel.photos.map((p) => (
            <figure key={p.id}>
              {/* Proxied through this link's own route: the store's addresses are never shown. */}
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img
                src={`${base}/photos/${p.id}`}
                alt={p.caption}
                loading="lazy"
                className="aspect-[4/3] w-full rounded object-cover"
              />
              <figcaption className="text-xs text-slate-600">{p.caption}</figcaption>
            </figure>
          ))}
        </div>
      ) : null}
    </section>
  );
}

/** The customer's report on a phone: no account, no app navigation, the same facts as the PDF. */
export function PublicReport({ view, base }: { view: ReportView; base: string }) {
  return (
    <main className="mx-auto flex max-w-2xl flex-col gap-4 p-4">
      <header>
        <p className="text-sm text-slate-600">{view.shop.name}</p>
        <h1 className="text-2xl font-bold">Job {view.jobNumber} completion report</h1>
        <p>
          {view.customer} · {view.vehicle} · VIN {view.vin}
        </p>
        {view.signedOff ? (
          <p className="text-sm">
            Signed off by {view.signedOff.by}, {view.signedOff.at}
          </p>
        ) : null}
      </header>
      <p>{view.summary}</p>
      {view.recheck ? (
        <section className="rounded-lg border-l-4 border-amber-600 bg-amber-50 p-4">
          <h2 className="font-bold">Ring bolt re-check due by {view.recheck.dueOn}</h2>
          <ul className="mt-1 list-disc pl-5 text-sm">
            {view.recheck.what.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </section>
      ) : null}
      <a
        href={`${base}/report.pdf`}
        className="self-start rounded bg-slate-900 px-4 py-3 font-semibold text-white"
      >
        Open the PDF report
      </a>
      {view.wheels.map((w) => (
        <WheelCard key={w.position} wheel={w} base={base} />
      ))}
      {view.acknowledgements.length ? (
        <section>
          <h2 className="text-lg font-bold">Noted at sign-off</h2>
          <ul className="mt-1 space-y-1 text-sm">
            {view.acknowledgements.map((a) => (
              <li key={`${a.wheel}${a.message}`}>
                {a.wheel}: {a.message} Reason: {a.reason} ({a.by})
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section>
        <h2 className="text-lg font-bold">Cautions</h2>
        <ul className="mt-1 list-disc space-y-1 pl-5 text-sm">
          {view.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
        <p className="mt-3 font-semibold">{view.makerFirst}</p>
      </section>
    </main>
  );
}
