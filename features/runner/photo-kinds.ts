/**
 * The photos a wheel's record can hold: the one list. The upload route, the runner's photo slots,
 * its submit check and the review's required photos all read it. The database enum
 * (`photo_kind` in db/schema, which may not import features) is held to it by a unit test.
 */
export const PHOTO_KINDS = ['bead_outer', 'bead_inner', 'other'] as const;
export type PhotoKind = (typeof PHOTO_KINDS)[number];

type PhotoKindInfo = {
  /** The slot's title in the runner and the photo's caption on a record. */
  label: string;
  /** A short name for a checklist line ("outer bead ✓"). */
  short: string;
  /** The wheel cannot be submitted without it: proof the bead is seated on both faces. */
  required: boolean;
};

export const PHOTO_KIND_INFO: Record<PhotoKind, PhotoKindInfo> = {
  bead_outer: { label: 'Seated bead, outer face', short: 'outer bead', required: true },
  bead_inner: { label: 'Seated bead, inner face', short: 'inner bead', required: true },
  other: { label: 'Other photo', short: 'other photo', required: false },
};

export const REQUIRED_PHOTOS = PHOTO_KINDS.filter((kind) => PHOTO_KIND_INFO[kind].required);

/** The required photos not yet taken, in list order. */
export const missingPhotos = (taken: readonly string[]) =>
  REQUIRED_PHOTOS.filter((kind) => !taken.includes(kind));
