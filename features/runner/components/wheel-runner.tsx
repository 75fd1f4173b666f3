'use client';

import { postWheelEvents } from '../api/post-events';
import { Runner, type RunnerProps } from './runner';

/**
 * The runner on a real wheel: its outbox sends to `POST /api/wheels/:id/events`. A client
 * component of its own because a server page cannot hand a function to the Runner.
 */
export function WheelRunner(props: Omit<RunnerProps, 'saveEvents'>) {
  return <Runner {...props} saveEvents={postWheelEvents} />;
}
