import 'server-only';
import { and, eq } from 'drizzle-orm';
import { createUploadthing, type FileRouter } from 'uploadthing/next';
import { UploadThingError, UTApi } from 'uploadthing/server';
import { z } from 'zod';
import { getDb } from '@/db';
import { wheelPhotos } from '@/db/schema';
import { cleanString } from '@/features/ui/bounded';
import { requireMemberForRequest } from '@/server/auth/guard';
import { DomainError } from '@/server/errors';
import { inspectPhoto } from './photo-check';
import { assertMayRun, loadWheel } from './run';

const f = createUploadthing();

export const photoInput = z.object({
  wheelId: z.uuid(),
  kind: z.enum(['bead_outer', 'bead_inner', 'other']),
  note: cleanString('the note', 300).default(''),
});

/** Photo evidence for a wheel: who may add it is checked here, what it is after it arrives. */
export const photoRouter = {
  wheelPhoto: f({ image: { maxFileSize: '16MB', maxFileCount: 1 } })
    .input(photoInput)
    .middleware(async ({ req, input }) => {
      try {
        const member = await requireMemberForRequest(req, 'jobs.run');
        const ctx = await loadWheel(member.shopId, input.wheelId);
        assertMayRun(member, ctx);
        if (ctx.wheel.submittedAt) throw new DomainError('conflict', 'This wheel was submitted; its evidence is closed.');
        return { userId: member.userId, shopId: member.shopId, jobId: ctx.job.id, wheelId: input.wheelId, kind: input.kind, note: input.note };
      } catch (error) {
        if (error instanceof DomainError) throw new UploadThingError({ code: error.code === 'unauthenticated' ? 'FORBIDDEN' : 'BAD_REQUEST', message: error.message });
        throw error;
      }
    })
    .onUploadComplete(async ({ metadata, file }) => {
      const res = await fetch(file.ufsUrl);
      const bytes = new Uint8Array(await res.arrayBuffer());
      const verdict = res.ok ? await inspectPhoto(bytes) : { ok: false as const, message: 'The photo could not be read back.' };
      if (!verdict.ok) {
        await new UTApi().deleteFiles(file.key);
        return { ok: false as const, message: verdict.message };
      }
      const [row] = await getDb()
        .insert(wheelPhotos)
        .values({ shopId: metadata.shopId, jobId: metadata.jobId, wheelId: metadata.wheelId, kind: metadata.kind, note: metadata.note, fileKey: file.key, url: file.ufsUrl, bytes: bytes.byteLength, mime: verdict.mime, uploadedById: metadata.userId })
        .returning({ id: wheelPhotos.id });
      return { ok: true as const, photoId: row!.id, kind: metadata.kind, url: file.ufsUrl };
    }),
} satisfies FileRouter;

export type PhotoRouter = typeof photoRouter;

export type WheelPhoto = { id: string; kind: 'bead_outer' | 'bead_inner' | 'other'; note: string; url: string };

export async function listPhotos(shopId: string, wheelId: string): Promise<WheelPhoto[]> {
  return getDb()
    .select({ id: wheelPhotos.id, kind: wheelPhotos.kind, note: wheelPhotos.note, url: wheelPhotos.url })
    .from(wheelPhotos)
    .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.wheelId, wheelId)));
}

/** Every wheel's photos of a job in one read, keyed by wheel id (for the job card's thumbnails). */
export async function listJobPhotos(shopId: string, jobId: string): Promise<Record<string, WheelPhoto[]>> {
  const rows = await getDb()
    .select({ wheelId: wheelPhotos.wheelId, id: wheelPhotos.id, kind: wheelPhotos.kind, note: wheelPhotos.note, url: wheelPhotos.url })
    .from(wheelPhotos)
    .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.jobId, jobId)));
  const byWheel: Record<string, WheelPhoto[]> = {};
  for (const { wheelId, ...photo } of rows) (byWheel[wheelId] ??= []).push(photo);
  return byWheel;
}
