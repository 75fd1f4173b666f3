import { describe, expect, it } from 'vitest';
import { allowedTransitions, transitionRefusal } from '@/features/jobs/transitions';

const lead = { userId: 'lead', role: 'lead' as const };
const otherLead = { userId: 'lead2', role: 'lead' as const };
const tech = { userId: 'tech', role: 'technician' as const };
const apprentice = { userId: 'app', role: 'apprentice' as const };
type Wheel = { position: string; submittedAt: string | null; flaggedReason: string | null };
const done: Wheel[] = [
  { position: 'LF', submittedAt: '2026-01-01T09:00:00Z', flaggedReason: null },
];
const job = (
  state: Parameters<typeof allowedTransitions>[1]['state'],
  assignee: string | null = 'tech',
  wheels = done,
) => ({ state, assignee: assignee ? { id: assignee } : null, wheels });

describe('job card transitions', () => {
  it('the assigned technician starts and submits; nobody else of that role', () => {
    expect(allowedTransitions(tech, job('open'))).toEqual(['start']);
    expect(allowedTransitions(tech, job('in_progress'))).toEqual(['submit']);
    expect(allowedTransitions({ ...tech, userId: 'tech2' }, job('open'))).toEqual([]);
  });
  it('a lead signs off or sends back, but not their own work', () => {
    expect(allowedTransitions(lead, job('awaiting_signoff'))).toEqual(['sign_off', 'send_back']);
    expect(transitionRefusal(lead, job('awaiting_signoff', 'lead'), 'sign_off')).toMatchObject({
      kind: 'person',
      message: expect.stringMatching(/You worked on this job card/),
    });
    expect(allowedTransitions(otherLead, job('awaiting_signoff', 'lead'))).toEqual([
      'sign_off',
      'send_back',
    ]);
  });
  it('a technician never signs off', () => {
    expect(transitionRefusal(tech, job('awaiting_signoff', 'someone'), 'sign_off')).toMatchObject({
      message: 'Your role does not allow this.',
    });
  });
  it('a sent-back job is started again; a signed-off job goes nowhere', () => {
    expect(allowedTransitions(tech, job('sent_back'))).toEqual(['start']);
    for (const who of [lead, tech, apprentice])
      expect(allowedTransitions(who, job('signed_off'))).toEqual([]);
  });
  it('skipping a state is refused as a state problem', () => {
    expect(transitionRefusal(lead, job('open'), 'sign_off')).toMatchObject({ kind: 'state' });
    expect(transitionRefusal(lead, job('open'), 'submit')).toMatchObject({ kind: 'state' });
  });
  it('an apprentice moves nothing', () => {
    expect(allowedTransitions(apprentice, job('open', 'app'))).toEqual([]);
  });
  it('submit needs at least one wheel, every wheel submitted, none flagged', () => {
    expect(transitionRefusal(tech, job('in_progress', 'tech', []), 'submit')).toMatchObject({
      kind: 'record',
      message: expect.stringMatching(/no wheels/),
    });
    expect(
      transitionRefusal(
        tech,
        job('in_progress', 'tech', [{ position: 'RF', submittedAt: null, flaggedReason: null }]),
        'submit',
      ),
    ).toMatchObject({ kind: 'record', message: expect.stringMatching(/still open: RF/) });
    expect(
      transitionRefusal(
        tech,
        job('in_progress', 'tech', [
          { position: 'RF', submittedAt: '2026-01-01T09:00:00Z', flaggedReason: 'Cracked ring' },
        ]),
        'submit',
      ),
    ).toMatchObject({ kind: 'record', message: expect.stringMatching(/flagged \(RF\)/) });
  });
  it('who worked on the job, not who is assigned, decides who may sign it off', () => {
    expect(
      transitionRefusal(lead, job('awaiting_signoff', 'tech'), 'sign_off', { workerIds: ['lead'] }),
    ).toMatchObject({ kind: 'person' });
    expect(
      transitionRefusal(lead, job('awaiting_signoff', 'lead'), 'sign_off', { workerIds: ['tech'] }),
    ).toBeNull();
    expect(
      transitionRefusal(lead, job('awaiting_signoff', 'tech'), 'sign_off', {
        workerIds: ['lead'],
        selfSignoffAllowed: true,
      }),
    ).toBeNull();
  });
});
