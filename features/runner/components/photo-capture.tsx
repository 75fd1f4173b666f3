'use client';

import { useState } from 'react';
import { downscale, oursOnly, UploadButton } from '../api/upload-photo';
import { PHOTO_KIND_INFO, PHOTO_KINDS } from '../photo-kinds';
import type { WheelPhoto } from '../server/photo-router';

export type Photo = WheelPhoto;

/** Take or pick a photo, shrink it, upload it with a progress bar, show the thumbnail. */
export function PhotoCapture({
  wheelId,
  photos,
  onAdded,
}: {
  wheelId: string;
  photos: Photo[];
  onAdded: (p: Photo) => void;
}) {
  return (
    <section aria-label="Photos" className="flex flex-col gap-3">
      {PHOTO_KINDS.map((kind) => (
        <PhotoSlot
          key={kind}
          wheelId={wheelId}
          kind={kind}
          photos={photos.filter((p) => p.kind === kind)}
          onAdded={onAdded}
        />
      ))}
    </section>
  );
}

/** One photo slot; the bolt-problem form uses an 'other' slot for a photo of the damaged bolt. */
export function PhotoSlot({
  wheelId,
  kind,
  photos,
  onAdded,
}: {
  wheelId: string;
  kind: Photo['kind'];
  photos: Photo[];
  onAdded: (p: Photo) => void;
}) {
  const [progress, setProgress] = useState<number | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const title = `${PHOTO_KIND_INFO[kind].label}${PHOTO_KIND_INFO[kind].required ? ' (required)' : ''}`;
  const done = (text: string | null) => {
    setProgress(null);
    setMessage(text);
  };

  return (
    <div className="border-paper-line flex flex-col gap-2 rounded-xl border-2 p-3">
      <p className="font-bold">{title}</p>
      {kind === 'other' ? (
        <input
          aria-label="Note for the other photo"
          value={note}
          onChange={(e) => setNote(e.target.value)}
          placeholder="What it shows"
          className="border-ink-soft min-h-14 rounded-xl border-2 px-3"
        />
      ) : null}
      <div className="flex flex-wrap gap-2">
        {photos.map((p) => (
          // eslint-disable-next-line @next/next/no-img-element -- evidence served by the upload service, shown as is
          <img
            key={p.id}
            src={p.url}
            alt={`${PHOTO_KIND_INFO[p.kind].label}${p.note ? `: ${p.note}` : ''}`}
            className="border-ink size-24 rounded-lg border-2 object-cover"
          />
        ))}
      </div>
      <UploadButton
        endpoint="wheelPhoto"
        input={{ wheelId, kind, note }}
        config={{ mode: 'auto', cn: oursOnly }}
        onBeforeUploadBegin={async (files) => {
          done(null);
          setProgress(0);
          return Promise.all(files.map((file) => downscale(file)));
        }}
        onUploadProgress={setProgress}
        onUploadAborted={() => done('Upload stopped. Nothing was saved; take the photo again.')}
        onUploadError={(error) => done(error.message)}
        onClientUploadComplete={(files) => {
          const data = files[0]?.serverData;
          if (!data) return done('The upload service did not answer. Try again.');
          if (!data.ok) return done(data.message);
          done(null);
          onAdded({ id: data.photoId, kind, note, url: data.url });
        }}
        appearance={{
          container: 'flex flex-col items-stretch gap-1',
          button: ({ ready, isUploading }) =>
            `relative flex min-h-14 cursor-pointer items-center justify-center rounded-xl px-4 text-lg font-bold text-white focus-within:outline focus-within:outline-4 focus-within:outline-offset-2 focus-within:outline-work ${!ready ? 'bg-ink-soft' : isUploading ? 'bg-work-dark' : 'bg-work'}`,
          allowedContent: 'text-sm text-ink-soft',
        }}
        content={{
          button: ({ ready, isUploading, uploadProgress }) => (
            <>
              {!ready
                ? 'Getting ready…'
                : isUploading
                  ? `Uploading ${Math.round(uploadProgress)} % · tap to stop`
                  : photos.length
                    ? 'Take or choose another'
                    : 'Take or choose a photo'}
              <span className="sr-only"> — {title}</span>
            </>
          ),
          allowedContent: 'JPEG, PNG or WebP photo, at most 10 MB; shrunk on this phone first.',
        }}
      />
      {progress !== null ? (
        <progress
          max={100}
          value={progress}
          aria-label={`Uploading ${PHOTO_KIND_INFO[kind].label}`}
          className="h-4 w-full"
        />
      ) : null}
      {message ? (
        <p role="alert" className="text-danger font-bold">
          {message}
        </p>
      ) : null}
    </div>
  );
}
