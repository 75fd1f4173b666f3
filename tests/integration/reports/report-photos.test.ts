import { rmSync, writeFileSync } from 'node:fs';
import { createServer, type AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { wheelPhotos } from '@/db/schema';
import { loadReportImages } from '@/features/reports/server/report-photos';
import { startUploadFake, type UploadFake } from '@/server/dev/upload-fake';
import { signedOffJob } from '@/tests/helpers/report-work';

// The report reads the private store through URLs it signs itself, without the upload SDK: the
// local fake of the service (which checks the signature on private files) must hand them over.
const dir = path.join(os.tmpdir(), `ringpass-report-photos-${process.pid}`);
let fake: UploadFake;

beforeAll(async () => {
  const probe = createServer().listen(0, '127.0.0.1');
  await new Promise((r) => probe.once('listening', r));
  const port = (probe.address() as AddressInfo).port;
  await new Promise((r) => probe.close(r));
  fake = await startUploadFake({ port, dir });
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
});
