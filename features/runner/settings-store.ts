'use client';

import { create } from 'zustand';
import { persist } from 'zustand/middleware';

/** Device-only preferences of the runner, remembered on this phone. */
type RunnerSettings = {
  speak: boolean;
  vibrate: boolean;
  toggleSpeak: () => void;
  toggleVibrate: () => void;
};

export const useRunnerSettings = create<RunnerSettings>()(
  persist(
    (set) => ({
      speak: false,
      vibrate: true,
      toggleSpeak: () => set((s) => ({ speak: !s.speak })),
      toggleVibrate: () => set((s) => ({ vibrate: !s.vibrate })),
    }),
    { name: 'ringpass-runner-settings' },
  ),
);
