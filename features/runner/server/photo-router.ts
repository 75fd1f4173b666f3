import 'server-only';
import { and, eq } from 'drizzle-orm';
import { createUploadthing, type FileRouter } from 'uploadthing/next';
import { UploadThingError, UTApi } from 'uploadthing/server';
import { z } from 'zod';
import { getDb } from '@/db';
import { jobWheels, wheelPhotos } from '@/db/schema';
import { cleanString } from '@/features/ui/bounded';
import { requireMemberForRequest } from '@/server/auth/guard';
import { DomainError } from '@/server/errors';
import { PHOTO_KIND_INFO, PHOTO_KINDS, type PhotoKind } from '../photo-kinds';
import { photoPath } from '../photo-path';
import { inspectPhotoStream } from './photo-check';
import { assertMayRun, loadWheel } from './run';

const f = createUploadthing();

export const photoInput = z.object({
  wheelId: z.uuid(),
  kind: z.enum(PHOTO_KINDS),
  note: cleanString('the note', 300).default(''),
});

/**
 * Photo evidence for a wheel: who may add it is checked here, what it is after it arrives. The
 * files are private at the upload service; people see them through /api/photos/:id only.
 */
export const photoRouter = {
  wheelPhoto: f({ image: { maxFileSize: '16MB', maxFileCount: 1, acl: 'private' } })
    .input(photoInput)
    .middleware(async ({ req, input }) => {
      try {
        const member = await requireMemberForRequest(req, 'jobs.run');
        const ctx = await loadWheel(member.shopId, input.wheelId);
        assertMayRun(member, ctx);
        if (ctx.wheel.submittedAt)
          throw new DomainError('conflict', 'This wheel was submitted; its evidence is closed.');
        return {
          userId: member.userId,
          shopId: member.shopId,
          jobId: ctx.job.id,
          wheelId: input.wheelId,
          kind: input.kind,
          note: input.note,
        };
      } catch (error) {
        if (error instanceof DomainError)
          throw new UploadThingError({
            code: error.code === 'unauthenticated' ? 'FORBIDDEN' : 'BAD_REQUEST',
            message: error.message,
          });
        throw error;
      }
    })
    .onUploadComplete(async ({ metadata, file }) => {
      // Read back through a short-lived signed URL (the file is private), streamed with a limit.
      const utapi = new UTApi();
      const { ufsUrl } = await utapi.generateSignedURL(file.key, { expiresIn: 60 });
      const res = await fetch(ufsUrl);
      // The wheel may have been submitted while the file travelled: its evidence is closed then too.
      const [wheel] = await getDb()
        .select({ submittedAt: jobWheels.submittedAt })
        .from(jobWheels)
        .where(and(eq(jobWheels.shopId, metadata.shopId), eq(jobWheels.id, metadata.wheelId)));
      const verdict =
        !wheel || wheel.submittedAt
          ? { ok: false as const, message: 'This wheel was submitted; its evidence is closed.' }
          : res.ok && res.body
            ? await inspectPhotoStream(res.body)
            : { ok: false as const, message: 'The photo could not be read back.' };
      if (!verdict.ok) {
        await utapi.deleteFiles(file.key);
        return { ok: false as const, message: verdict.message };
      }
      const [row] = await getDb()
        .insert(wheelPhotos)
        .values({
          shopId: metadata.shopId,
          jobId: metadata.jobId,
          wheelId: metadata.wheelId,
          kind: metadata.kind,
          note: metadata.note,
          fileKey: file.key,
          url: file.ufsUrl,
          bytes: verdict.bytes,
          mime: verdict.mime,
          uploadedById: metadata.userId,
        })
        .returning({ id: wheelPhotos.id });
      return { ok: true as const, photoId: row!.id, kind: metadata.kind, url: photoPath(row!.id) };
    }),
} satisfies FileRouter;

export type PhotoRouter = typeof photoRouter;

/** `url` is the app's own photo route (session and shop checked), never the storage's address. */
export type WheelPhoto = { id: string; kind: PhotoKind; note: string; url: string };

export async function listPhotos(shopId: string, wheelId: string): Promise<WheelPhoto[]> {
  const rows = await getDb()
    .select({ id: wheelPhotos.id, kind: wheelPhotos.kind, note: wheelPhotos.note })
    .from(wheelPhotos)
    .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.wheelId, wheelId)));
  return rows.map((p) => ({ ...p, url: photoPath(p.id) }));
}

/** Every wheel's photos of a job in one read, keyed by wheel id (for the job card's thumbnails). */
/** A job's photos by wheel, each with its caption from the one photo list (the job card shows them). */
export async function listJobPhotos(
  shopId: string,
  jobId: string,
): Promise<Record<string, (WheelPhoto & { label: string })[]>> {
  const rows = await getDb()
    .select({
      wheelId: wheelPhotos.wheelId,
      id: wheelPhotos.id,
      kind: wheelPhotos.kind,
      note: wheelPhotos.note,
    })
    .from(wheelPhotos)
    .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.jobId, jobId)));
  const byWheel: Record<string, (WheelPhoto & { label: string })[]> = {};
  for (const { wheelId, ...photo } of rows)
    (byWheel[wheelId] ??= []).push({
      ...photo,
      url: photoPath(photo.id),
      label: PHOTO_KIND_INFO[photo.kind].label,
    });
  return byWheel;
}
