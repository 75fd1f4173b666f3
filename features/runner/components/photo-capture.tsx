'use client';

import { useState } from 'react';
import { downscale, useUploadThing } from '../api/upload-photo';
import type { WheelPhoto } from '../server/photo-router';

export type Photo = WheelPhoto;

const LABELS: Record<Photo['kind'], string> = { bead_outer: 'Seated bead, outer face', bead_inner: 'Seated bead, inner face', other: 'Other photo' };

/** Take or pick a photo, shrink it, upload it with a progress bar, show the thumbnail. */
export function PhotoCapture({ wheelId, photos, onAdded }: { wheelId: string; photos: Photo[]; onAdded: (p: Photo) => void }) {
  return (
    <section aria-label="Photos" className="flex flex-col gap-3">
      {(['bead_outer', 'bead_inner', 'other'] as const).map((kind) => (
        <PhotoSlot key={kind} wheelId={wheelId} kind={kind} photos={photos.filter((p) => p.kind === kind)} onAdded={onAdded} />
      ))}
    </section>
  );
}

function PhotoSlot({ wheelId, kind, photos, onAdded }: { wheelId: string; kind: Photo['kind']; photos: Photo[]; onAdded: (p: Photo) => void }) {
  const [progress, setProgress] = useState<number | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const { startUpload } = useUploadThing('wheelPhoto', {
    onUploadProgress: setProgress,
    onUploadError: (e) => {
      setProgress(null);
      setMessage(e.message);
    },
  });
  const id = `photo-${kind}`;

  async function pick(file: File | undefined) {
    if (!file) return;
    setMessage(null);
    setProgress(0);
    const result = await startUpload([await downscale(file)], { wheelId, kind, note });
    setProgress(null);
    const data = result?.[0]?.serverData;
    if (!data) return;
    if (data.ok) onAdded({ id: data.photoId, kind, note, url: data.url });
    else setMessage(data.message);
  }

  return (
    <div className="flex flex-col gap-2 rounded-xl border-2 border-paper-line p-3">
      <label htmlFor={id} className="font-bold">
        {LABELS[kind]}
        {kind !== 'other' ? ' (required)' : ''}
      </label>
      {kind === 'other' ? <input aria-label="Note for the other photo" value={note} onChange={(e) => setNote(e.target.value)} placeholder="What it shows" className="min-h-14 rounded-xl border-2 border-ink-soft px-3" /> : null}
      <div className="flex flex-wrap gap-2">
        {photos.map((p) => (
          // eslint-disable-next-line @next/next/no-img-element -- evidence served by the upload service, shown as is
          <img key={p.id} src={p.url} alt={`${LABELS[p.kind]}${p.note ? `: ${p.note}` : ''}`} className="size-24 rounded-lg border-2 border-ink object-cover" />
        ))}
      </div>
      <input id={id} type="file" accept="image/*" capture="environment" disabled={progress !== null} onChange={(e) => void pick(e.target.files?.[0])} className="min-h-14 text-base file:mr-3 file:min-h-14 file:rounded-xl file:border-0 file:bg-work file:px-4 file:font-bold file:text-white" />
      {progress !== null ? <progress max={100} value={progress} aria-label={`Uploading ${LABELS[kind]}`} className="h-4 w-full" /> : null}
      {message ? (
        <p role="alert" className="font-bold text-danger">
          {message}
        </p>
      ) : null}
    </div>
  );
}
