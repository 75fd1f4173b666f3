import 'server-only';
import { axleWarnings } from '@/features/jobs/axle-check';
import type { ReviewSources } from '@/features/review/server/review-data';
import { REQUIRED_PHOTOS } from '@/features/runner/photo-kinds';
import { stepsFor } from '@/features/runner/steps';

/** Where the review meets the runner (its steps and required photos) and the jobs feature (its axle check). */
export const reviewSources: ReviewSources = {
  stepsFor: (job) =>
    stepsFor(job).map((s) => ({ id: s.id, title: s.title, required: Boolean(s.required) })),
  requiredPhotos: REQUIRED_PHOTOS,
  axleWarnings,
};
