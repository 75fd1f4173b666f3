/**
 * `tsx tests/bench/phone-photos.ts <dir> <fileKey>...`: stores one phone picture per key where the
 * local upload fake serves it (private, as the app uploads them). Its own process, so the
 * benchmark that runs it keeps none of the image library's memory. Prints the average size in MB.
 */
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';

/**
 * A phone picture: 12 MP with texture (noise enlarged, so it neither compresses to nothing nor is
 * pure noise), stored landscape with EXIF orientation 6 as phones do, JPEG quality 90.
 */
async function phonePhoto(): Promise<Buffer> {
  const texture = await sharp({
    create: {
      width: 800,
      height: 600,
      channels: 3,
      background: '#6b7280',
      noise: { type: 'gaussian', mean: 110, sigma: 40 },
    },
  })
    .png()
    .toBuffer();
  return sharp(texture)
    .resize(4000, 3000, { kernel: 'cubic' })
    .withMetadata({ orientation: 6 })
    .jpeg({ quality: 90 })
    .toBuffer();
}

const [dir, ...keys] = process.argv.slice(2);
let bytes = 0;
for (const key of keys) {
  const jpeg = await phonePhoto();
  bytes += jpeg.byteLength;
  writeFileSync(path.join(dir!, key), jpeg);
  writeFileSync(
    path.join(dir!, `${key}.json`),
    JSON.stringify({ type: 'image/jpeg', name: `${key}.jpg`, acl: 'private' }),
  );
}
process.stdout.write(`${(bytes / keys.length / 1024 / 1024).toFixed(1)}\n`);
