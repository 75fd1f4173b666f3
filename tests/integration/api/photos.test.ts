import { createHmac } from 'node:crypto';
import { rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as photoRoute from '@/app/api/photos/[photoId]/route';
import * as uploadRoute from '@/app/api/uploadthing/route';
import { getDb } from '@/db';
import { jobs, jobWheels, practiceClearances, users, wheelPhotos } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { startUploadFake, type UploadFake } from '@/server/dev/upload-fake';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';

// A JPEG by its first bytes (JFIF signature, per the JPEG File Interchange Format).
const JPEG = (() => {
  const b = new Uint8Array(20_000);
  b.set([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01]);
  return b;
})();

const dir = path.join(os.tmpdir(), `ringpass-photos-${process.pid}`);
let fake: UploadFake, app: Server, appUrl: string, apiKey: string;
let shop: Awaited<ReturnType<typeof createTestShop>>,
  other: Awaited<ReturnType<typeof createTestShop>>,
  wheelId: string,
  tech: string;

/** The route handler behind a real socket, so the upload fake can call the app back as the service does. */
function serveUploadRoute() {
  return createServer((req, res) => {
    void (async () => {
      const request = new Request(`${appUrl}${req.url}`, {
        method: req.method,
        headers: req.headers as HeadersInit,
        body: req.method === 'GET' ? undefined : (Readable.toWeb(req) as ReadableStream),
        duplex: 'half',
      } as RequestInit);
      const response = await (req.method === 'GET' ? uploadRoute.GET : uploadRoute.POST)(
        request as never,
      );
      res.writeHead(response.status, Object.fromEntries(response.headers));
      res.end(Buffer.from(await response.arrayBuffer()));
    })();
  });
}

beforeAll(async () => {
  // Port 0: the fake takes a free port itself (a probed port could be taken before it listens).
  fake = await startUploadFake({ port: 0, dir });
  Object.assign(process.env, fake.env, { UPLOADTHING_LOG_LEVEL: 'Error' });
  apiKey = (
    JSON.parse(Buffer.from(fake.env.UPLOADTHING_TOKEN!, 'base64').toString()) as { apiKey: string }
  ).apiKey;
  app = serveUploadRoute().listen(0, '127.0.0.1');
  await new Promise((r) => app.once('listening', r));
  appUrl = `http://127.0.0.1:${(app.address() as AddressInfo).port}`;
  shop = await createTestShop();
  other = await createTestShop('Other');
  const records = await createRecords(shop.lead, shop.technician.userId);
  wheelId = (await getJob(shop.shopId, records.job.id)).wheels[0]!.id;
  tech = await cookieFor(shop.technician.userId);
});

afterAll(async () => {
  await new Promise((r) => app.close(r));
  await fake.close();
  rmSync(dir, { recursive: true, force: true });
});

/** The SDK's two steps as the phone makes them: ask the app for a presigned URL, then PUT the file. */
async function upload(
  bytes: Uint8Array,
  init: { origin?: string | null; declaredSize?: number } = {},
) {
  const headers: Record<string, string> = {
    cookie: tech,
    'content-type': 'application/json',
    'x-uploadthing-package': '@uploadthing/react',
    'x-uploadthing-version': '7.7.4',
  };
  if (init.origin !== null) headers.origin = init.origin ?? appUrl;
  const ask = await fetch(`${appUrl}/api/uploadthing?actionType=upload&slug=wheelPhoto`, {
    method: 'POST',
    headers,
    body: JSON.stringify({
      files: [
        {
          name: 'bead.jpg',
          size: init.declaredSize ?? bytes.byteLength,
          type: 'image/jpeg',
          lastModified: Date.now(),
        },
      ],
      input: { wheelId, kind: 'bead_outer' },
    }),
  });
  if (!ask.ok) return { ask };
  const url = ((await ask.json()) as { url: string; key: string }[])[0]!.url;
  const form = new FormData();
  form.set('file', new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), 'bead.jpg');
  const put = await fetch(url, { method: 'PUT', body: form });
  return {
    ask,
    put,
    body: (await put.json()) as {
      ufsUrl?: string;
      serverData?: { ok: boolean; photoId: string; url: string };
    },
  };
}

const getPhoto = (id: string, cookie?: string) =>
  photoRoute.GET(apiRequest(`/api/photos/${id}`, { cookie }), params({ photoId: id }));

describe('photos are private: served only through the app, to its own shop', () => {
  let photoId: string, storageUrl: string;

  it('an upload from the app goes through; the callback (no browser Origin, signed) stores it as the route path', async () => {
    const { put, body } = await upload(JPEG);
    expect(put?.status, JSON.stringify(body)).toBe(200);
    expect(body?.serverData).toMatchObject({
      ok: true,
      url: `/api/photos/${body!.serverData!.photoId}`,
    });
    photoId = body!.serverData!.photoId;
    const [row] = await getDb()
      .select({ url: wheelPhotos.url, bytes: wheelPhotos.bytes })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.id, photoId));
    expect(row!.bytes).toBe(JPEG.byteLength);
    storageUrl = row!.url;
  });

  it("the storage's own URL answers 403 without a signature, an expired or a forged one (it used to answer 200 to anyone)", async () => {
    expect((await fetch(storageUrl)).status).toBe(403);
    const sign = (url: string) =>
      `${url}&signature=${encodeURIComponent(`hmac-sha256=${createHmac('sha256', apiKey).update(url).digest('hex')}`)}`;
    expect((await fetch(sign(`${storageUrl}?expires=${Date.now() - 1000}`))).status).toBe(403);
    // Forge by changing the signature's last hex digit (to another digit: '0' could be what it was).
    const forged = sign(`${storageUrl}?expires=${Date.now() + 60_000}`).replace(/.$/, (d) =>
      d === '0' ? '1' : '0',
    );
    expect((await fetch(forged)).status).toBe(403);
    expect((await fetch(sign(`${storageUrl}?expires=${Date.now() + 60_000}`))).status).toBe(200);
  });

  it('GET /api/photos/:id: the shop sees the photo; signed out 401, apprentice 403, another shop 404', async () => {
    const res = await getPhoto(photoId, tech);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    expect(res.headers.get('cache-control')).toBe('private, max-age=300');
    expect(new Uint8Array(await res.arrayBuffer())).toEqual(JPEG);
    expect((await getPhoto(photoId)).status).toBe(401);
    expect((await getPhoto(photoId, await cookieFor(shop.apprentice.userId))).status).toBe(403);
    expect((await getPhoto(photoId, await cookieFor(other.lead.userId))).status).toBe(404);
  });

  it("GET /api/photos/:id for a cleared apprentice: their own wheel's photo 200, someone else's wheel 403, uncleared 403", async () => {
    const [second] = await getDb()
      .insert(users)
      .values({
        shopId: shop.shopId,
        role: 'apprentice',
        name: 'Rue Apprentice',
        email: `rue-${photoId}@shop.test`,
        passwordHash: 'x',
      })
      .returning({ id: users.id });
    const clear = (userId: string) =>
      getDb()
        .insert(practiceClearances)
        .values({ shopId: shop.shopId, userId, clearedById: shop.lead.userId });
    await clear(shop.apprentice.userId);
    await clear(second!.id);
    const [photo] = await getDb()
      .select({ jobId: wheelPhotos.jobId })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.id, photoId));
    const assign = (userId: string) =>
      getDb().update(jobs).set({ assigneeId: userId }).where(eq(jobs.id, photo!.jobId));
    try {
      await assign(shop.apprentice.userId);
      const own = await getPhoto(photoId, await cookieFor(shop.apprentice.userId));
      expect(own.status).toBe(200);
      expect(new Uint8Array(await own.arrayBuffer())).toEqual(JPEG);
      // Cleared too, but the wheel is not theirs.
      expect((await getPhoto(photoId, await cookieFor(second!.id))).status).toBe(403);
      // A lead revokes the clearance: the next request is refused, assigned or not.
      await getDb()
        .update(practiceClearances)
        .set({ revokedAt: new Date(), revokedById: shop.lead.userId })
        .where(eq(practiceClearances.userId, shop.apprentice.userId));
      expect((await getPhoto(photoId, await cookieFor(shop.apprentice.userId))).status).toBe(403);
      expect((await getPhoto(photoId, await cookieFor(other.lead.userId))).status).toBe(404);
      // The technician sees it still, though the job is no longer theirs.
      expect((await getPhoto(photoId, tech)).status).toBe(200);
    } finally {
      await assign(shop.technician.userId);
    }
  });

  it('an upload request without this app as its Origin is refused before the SDK sees it', async () => {
    for (const origin of [null, 'http://evil.test']) {
      const { ask } = await upload(JPEG, { origin });
      expect(ask.status).toBe(403);
      expect(await ask.json()).toMatchObject({ error: { code: 'cross_origin' } });
    }
  });

  it('a forged callback (hook header, wrong signature) is refused by the SDK and stores nothing', async () => {
    const before = (await getDb().select({ id: wheelPhotos.id }).from(wheelPhotos)).length;
    const payload = JSON.stringify({
      status: 'uploaded',
      file: {
        key: 'forged',
        name: 'x.jpg',
        size: 1,
        type: 'image/jpeg',
        url: storageUrl,
        appUrl: storageUrl,
        ufsUrl: storageUrl,
        fileHash: 'x',
        customId: null,
        lastModified: 0,
      },
      origin: appUrl,
      metadata: { shopId: other.shopId },
    });
    const res = await fetch(`${appUrl}/api/uploadthing?slug=wheelPhoto`, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'uploadthing-hook': 'callback',
        'x-uploadthing-signature': 'hmac-sha256=00',
      },
      body: payload,
    });
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect((await getDb().select({ id: wheelPhotos.id }).from(wheelPhotos)).length).toBe(before);
  });

  it('the upload store refuses more bytes than the size the app agreed to', async () => {
    const { put } = await upload(JPEG, { declaredSize: 1000 });
    expect(put?.status).toBe(413);
  });
});

describe('evidence closes with the wheel', () => {
  it('an upload for a submitted wheel is refused; once a send-back reopens the wheel it is taken again', async () => {
    await getDb()
      .update(jobWheels)
      .set({ submittedAt: new Date() })
      .where(eq(jobWheels.id, wheelId));
    const before = (
      await getDb()
        .select({ id: wheelPhotos.id })
        .from(wheelPhotos)
        .where(eq(wheelPhotos.wheelId, wheelId))
    ).length;
    const { ask } = await upload(JPEG);
    expect(ask.status).toBe(400);
    expect(await ask.text()).toMatch(/submitted; its evidence is closed/);
    expect(
      (
        await getDb()
          .select({ id: wheelPhotos.id })
          .from(wheelPhotos)
          .where(eq(wheelPhotos.wheelId, wheelId))
      ).length,
    ).toBe(before);
    await getDb().update(jobWheels).set({ submittedAt: null }).where(eq(jobWheels.id, wheelId));
    const { put, body } = await upload(JPEG);
    expect(put?.status, JSON.stringify(body)).toBe(200);
    expect(body?.serverData).toMatchObject({ ok: true });
  });
});
