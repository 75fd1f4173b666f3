import { levelTrends, scoreSeries } from '../progress';
import type { Progress } from '../server/progress';
import { AttemptList } from './attempt-list';
import { ClearanceForm } from './clearance-form';
import { ClearanceStatus } from './clearance-status';
import { ScoreChart } from './score-chart';
import { ScoreTable } from './score-table';
import { TrendTable } from './trend-table';

const SECTION = 'border-paper-line flex flex-col gap-3 rounded-xl border-2 p-4';

/** An apprentice's own attempts and trend, and whether they are cleared for real wheels. */
function OwnProgress({ progress }: { progress: Progress }) {
  const standing = progress.apprentices[0];
  return (
    <div className="flex flex-col gap-6">
      {standing ? (
        <section aria-labelledby="clearance-heading" className={SECTION}>
          <h2 id="clearance-heading" className="text-xl font-bold">
            Real wheels
          </h2>
          <ClearanceStatus standing={standing} />
        </section>
      ) : null}
      <section aria-labelledby="trend-heading" className={SECTION}>
        <h2 id="trend-heading" className="text-xl font-bold">
          Your trend
        </h2>
        <TrendTable trends={levelTrends(progress.attempts)} caption="Mean score per level" />
      </section>
      <section aria-labelledby="attempts-heading" className={SECTION}>
        <h2 id="attempts-heading" className="text-xl font-bold">
          Your attempts
        </h2>
        <AttemptList attempts={progress.attempts} showPerson={false} />
      </section>
    </div>
  );
}

/** The lead's view: every apprentice's standing and trend, the chart with its table, all attempts. */
function ShopProgress({ progress }: { progress: Progress }) {
  const series = scoreSeries(progress.attempts);
  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="apprentices-heading" className="flex flex-col gap-3">
        <h2 id="apprentices-heading" className="text-xl font-bold">
          Apprentices ({progress.apprentices.length})
        </h2>
        {progress.apprentices.length === 0 ? (
          <p className="text-ink-soft">No apprentices on the team.</p>
        ) : null}
        {progress.apprentices.map((a) => (
          <article key={a.userId} aria-label={a.name} className={SECTION}>
            <h3 className="text-lg font-bold">{a.name}</h3>
            <ClearanceStatus standing={a} />
            <ClearanceForm userId={a.userId} name={a.name} cleared={a.cleared} />
            <TrendTable
              trends={levelTrends(progress.attempts.filter((t) => t.userId === a.userId))}
              caption={`${a.name}: mean score per level`}
            />
          </article>
        ))}
      </section>
      <section aria-labelledby="chart-heading" className={SECTION}>
        <h2 id="chart-heading" className="text-xl font-bold">
          Scores over time
        </h2>
        {series.length === 0 ? (
          <p className="text-ink-soft">No finished attempts yet.</p>
        ) : (
          <div className="grid gap-4 lg:grid-cols-2">
            <ScoreChart series={series} />
            <ScoreTable series={series} />
          </div>
        )}
      </section>
      <section aria-labelledby="attempts-heading" className={SECTION}>
        <h2 id="attempts-heading" className="text-xl font-bold">
          Every attempt
        </h2>
        <AttemptList attempts={progress.attempts} showPerson />
      </section>
    </div>
  );
}

export function ProgressView({ progress }: { progress: Progress }) {
  return progress.scope === 'shop' ? (
    <ShopProgress progress={progress} />
  ) : (
    <OwnProgress progress={progress} />
  );
}
