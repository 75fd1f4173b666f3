import { rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { getDb } from '@/db';
import { wheelPhotos } from '@/db/schema';
import { loadReportImages } from '@/features/reports/server/report-photos';
import { startUploadFake, type UploadFake } from '@/server/dev/upload-fake';
import { withGarbledToken } from '@/tests/helpers/garbled-store';
import { signedOffJob } from '@/tests/helpers/report-work';
import type * as StoreConfigModule from '@/server/storage/store-config';

vi.mock('@/server/storage/store-config', async (load) => {
  const { garbleable } = await import('@/tests/helpers/garbled-store');
  return garbleable(await load<typeof StoreConfigModule>());
});

// The report reads the private store through URLs signed without UTApi (server/storage/): the
// local fake of the service (which checks the signature on private files) must hand them over.
const dir = path.join(os.tmpdir(), `ringpass-report-photos-${process.pid}`);
let fake: UploadFake;

beforeAll(async () => {
  // Port 0: the fake takes a free port itself (a probed port could be taken before it listens).
  fake = await startUploadFake({ port: 0, dir });
  // Before anything reads the app's configuration (read once, on first use).
  Object.assign(process.env, fake.env);
});

afterAll(async () => {
  await fake.close();
  rmSync(dir, { recursive: true, force: true });
});

/** A phone picture as the store keeps it: private, 3000×4000 stored sideways (EXIF orientation 6). */
async function storePhoto(fileKey: string) {
  const jpeg = await sharp({
    create: { width: 4000, height: 3000, channels: 3, background: '#6b7280' },
  })
    .withMetadata({ orientation: 6 })
    .jpeg()
    .toBuffer();
  writeFileSync(path.join(dir, fileKey), jpeg);
  writeFileSync(
    path.join(dir, `${fileKey}.json`),
    JSON.stringify({ type: 'image/jpeg', name: `${fileKey}.jpg`, acl: 'private' }),
  );
}

describe("the report's photos", () => {
  it('are read from the private store and put in upright at 640 px; a missing file is left out', async () => {
    const { shop, job } = await signedOffJob(new Date());
    const rows = await getDb()
      .select({ id: wheelPhotos.id, fileKey: wheelPhotos.fileKey })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.jobId, job.id));
    const [missing, ...stored] = rows;
    for (const row of stored) await storePhoto(row.fileKey);

    const images = await loadReportImages(
      shop.shopId,
      job.id,
      rows.map((r) => r.id),
    );

    expect(images[missing!.id]).toBeNull();
    for (const row of stored) {
      const image = images[row.id];
      expect(image?.format).toBe('jpg');
      const { width, height } = await sharp(image!.data).metadata();
      expect({ width, height }).toEqual({ width: 480, height: 640 });
    }
  });

  it('fail the whole build, with the reason, when the store is misconfigured', async () => {
    const { shop, job } = await signedOffJob(new Date());
    const ids = await getDb()
      .select({ id: wheelPhotos.id })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.jobId, job.id));
    await withGarbledToken(() =>
      expect(
        loadReportImages(
          shop.shopId,
          job.id,
          ids.map((r) => r.id),
        ),
      ).rejects.toThrow('UPLOADTHING_TOKEN is not base64'),
    );
  });
});
