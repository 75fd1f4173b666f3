import { formatDuration } from '@/features/runner/duration';
import { MAKER_FIRST } from '@/features/runner/steps';
import { passWords } from '../words';
import { practicePlan } from '../plan';
import type { MistakeKind, PracticeResult, PracticeSetup } from '../types';
import { PassCompare } from './pass-compare';

const KIND_WORDS: Record<MistakeKind, string> = {
  bolt_out_of_sequence: 'Out of sequence',
  wrong_wrench: 'Wrong wrench',
  wrong_setting: 'Wrong setting',
  unit_mistake: 'Unit mistake',
  skipped_caution: 'Skipped caution',
  skipped_check: 'Skipped check',
  unfinished: 'Not finished',
};

const LEVEL_WORDS: Record<PracticeSetup['level'], string> = {
  guided: 'Guided',
  from_memory: 'From memory',
  wrench_setup: 'Wrench setup',
};

/**
 * The result of an attempt: the score out of 100 and how it is made up, each mistake in trade
 * words with what was expected, each pass with a mistake drawn as done beside expected, and the
 * time on each step.
 */
export function AttemptResult({ setup, result }: { setup: PracticeSetup; result: PracticeResult }) {
  const plan = practicePlan(setup);
  const { spec } = setup.snapshot;
  const outOfOrder = (pass: number) =>
    result.mistakes
      .filter((m) => m.kind === 'bolt_out_of_sequence' && m.pass === pass && m.bolt !== null)
      .map((m) => m.bolt as number);
  const passesToShow = result.passes.filter(
    (p) =>
      result.mistakes.some((m) => m.pass === p.pass) || p.done.some((b, i) => p.expected[i] !== b),
  );
  const timed = plan.steps.filter((s) => result.secondsPerStep[s.id] !== undefined);

  return (
    <article className="space-y-6" aria-labelledby="attempt-score">
      <header>
        <h2 id="attempt-score" className="text-2xl font-extrabold">
          Score: {result.score} out of 100
        </h2>
        <p className="text-sm">
          {LEVEL_WORDS[setup.level]} · {spec.name} · {spec.boltCount} bolts · {setup.wheel.position}{' '}
          {setup.wheel.tireSize}
        </p>
      </header>

      <section aria-labelledby="score-parts">
        <h3 id="score-parts" className="text-lg font-bold">
          How the score is made up
        </h3>
        <table aria-labelledby="score-parts" className="mt-2 w-full max-w-md text-left text-sm">
          <thead>
            <tr>
              <th scope="col">Part</th>
              <th scope="col" className="text-right">
                Points
              </th>
              <th scope="col" className="text-right">
                Out of
              </th>
            </tr>
          </thead>
          <tbody>
            {result.parts.map((p) => (
              <tr key={p.label}>
                <th scope="row" className="font-normal">
                  {p.label}
                </th>
                <td className="text-right">{p.points}</td>
                <td className="text-right">{p.max}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="font-bold">
              <th scope="row">Total</th>
              <td className="text-right">{result.score}</td>
              <td className="text-right">100</td>
            </tr>
          </tfoot>
        </table>
      </section>

      <section aria-labelledby="mistakes">
        <h3 id="mistakes" className="text-lg font-bold">
          Mistakes ({result.mistakes.length})
        </h3>
        {result.mistakes.length === 0 ? (
          <p>None: every bolt in order, every check done.</p>
        ) : (
          <ol className="mt-2 space-y-2">
            {result.mistakes.map((m, i) => (
              <li key={i} className="border-paper-line rounded border-l-4 p-2">
                <p>
                  <strong>{KIND_WORDS[m.kind]}</strong>
                  {m.points ? ` (−${m.points} ${m.points === 1 ? 'point' : 'points'})` : ''}:{' '}
                  {m.message}
                </p>
                {m.expected && m.kind !== 'skipped_check' && m.kind !== 'skipped_caution' ? (
                  <p className="text-sm">Expected: {m.expected}</p>
                ) : null}
              </li>
            ))}
          </ol>
        )}
      </section>

      {passesToShow.length ? (
        <section aria-labelledby="passes" className="space-y-3">
          <h3 id="passes" className="text-lg font-bold">
            Passes with a mistake: the order done beside the order expected
          </h3>
          {passesToShow.map((p) => (
            <PassCompare
              key={p.pass}
              pass={p}
              label={passWords(setup, p.pass)}
              boltCount={spec.boltCount}
              outOfOrder={outOfOrder(p.pass)}
            />
          ))}
        </section>
      ) : null}

      {timed.length ? (
        <section aria-labelledby="step-times">
          <h3 id="step-times" className="text-lg font-bold">
            Time on each step
          </h3>
          <table aria-labelledby="step-times" className="mt-2 w-full max-w-md text-left text-sm">
            <thead>
              <tr>
                <th scope="col">Step</th>
                <th scope="col" className="text-right">
                  Time
                </th>
              </tr>
            </thead>
            <tbody>
              {timed.map((s) => (
                <tr key={s.id}>
                  <th scope="row" className="font-normal">
                    {s.title}
                  </th>
                  <td className="text-right">
                    {formatDuration((result.secondsPerStep[s.id] ?? 0) * 1000)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}

      <p className="text-sm">Practice on a made-up wheel. {MAKER_FIRST}</p>
    </article>
  );
}
