'use client';

import dynamic from 'next/dynamic';
import type { ComponentType } from 'react';
import { StepLoading, StepNotLoaded } from './step-loading';

/**
 * The runner's parts that only some steps show, each loaded when its step opens (next/dynamic):
 * the technician's first load carries the steps, the bolt circle and the big button, not the
 * photo uploader, the verification form, the summary or the bolt-problem form. A part shown on
 * the first render is still rendered on the server and its script preloaded with the page; the
 * service worker keeps every script of the build for a reload without Wi-Fi.
 */
export function onDemand<P extends object>(
  load: () => Promise<ComponentType<P>>,
  what: string,
  height: string,
) {
  const NotLoaded = () => <StepNotLoaded what={what} />;
  return dynamic<P>(() => load().catch(() => NotLoaded as ComponentType<P>), {
    loading: () => <StepLoading what={what} height={height} />,
  });
}

export const PhotoCapture = onDemand(
  () => import('./photo-capture').then((m) => m.PhotoCapture),
  'the photo slots',
  'min-h-96',
);
export const PhotoSlot = onDemand(
  () => import('./photo-capture').then((m) => m.PhotoSlot),
  'the photo slot',
  'min-h-40',
);
export const VerifyInline = onDemand(
  () => import('./verify-inline').then((m) => m.VerifyInline),
  'the wrench check',
  'min-h-72',
);
export const VerifyAskOthers = onDemand(
  () => import('./verify-inline').then((m) => m.VerifyAskOthers),
  'the wrench check',
  'min-h-24',
);
export const BoltProblemForm = onDemand(
  () => import('./bolt-problem').then((m) => m.BoltProblemForm),
  'the bolt problem form',
  'min-h-96',
);
export const WrenchSetupCard = onDemand(
  () => import('./wrench-setup-card').then((m) => m.WrenchSetupCard),
  'the wrench setup',
  'min-h-72',
);
export const SummaryPanel = onDemand(
  () => import('./summary-panel').then((m) => m.SummaryPanel),
  'the summary',
  'min-h-96',
);
export const ReinstallPanel = onDemand(
  () => import('./reinstall-panel').then((m) => m.ReinstallPanel),
  'the re-install step',
  'min-h-96',
);
