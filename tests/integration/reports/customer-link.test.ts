import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import { renderToStaticMarkup } from 'react-dom/server';
import sharp from 'sharp';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import * as reportRoute from '@/app/api/jobs/[jobId]/report/route';
import * as photoRoute from '@/app/api/photos/[photoId]/route';
import * as publicPhotoRoute from '@/app/r/[token]/photos/[photoId]/route';
import CustomerReportPage from '@/app/r/[token]/page';
import * as publicPdfRoute from '@/app/r/[token]/report.pdf/route';
import { getDb } from '@/db';
import { reportLinks, wheelPhotos } from '@/db/schema';
import { composeCustomerReportEmail } from '@/features/reports/server/customer-email';
import {
  createReportLink,
  revokeReportLink,
  tokenHashOf,
} from '@/features/reports/server/report-links';
import { apiRequest, params } from '@/tests/helpers/factories';
import { withGarbledToken } from '@/tests/helpers/garbled-store';
import { signedOffJob } from '@/tests/helpers/report-work';
import type * as StoreConfigModule from '@/server/storage/store-config';

// The photo store, as the upload service would answer a signed URL: a real 1600×1200 JPEG.
// (server/storage signs the URLs; signed-url.test.ts holds them equal to the SDK's.)
let JPEG: Buffer;
let storeUrl = () => `data:image/jpeg;base64,${JPEG.toString('base64')}`;
vi.mock('@/server/storage/signed-url', () => ({ signedFileUrl: async () => storeUrl() }));
vi.mock('@/server/storage/store-config', async (load) => {
  const { garbleable } = await import('@/tests/helpers/garbled-store');
  return garbleable(await load<typeof StoreConfigModule>());
});
beforeAll(async () => {
  JPEG = await sharp({
    create: { width: 1600, height: 1200, channels: 3, background: '#6b7280' },
  })
    .jpeg()
    .toBuffer();
});

const page = async (token: string) =>
  renderToStaticMarkup(await CustomerReportPage({ params: Promise.resolve({ token }) } as never));
const pdf = (token: string) =>
  publicPdfRoute.GET(new Request(`http://127.0.0.1:3000/r/${token}/report.pdf`), {
    params: Promise.resolve({ token }),
  } as never);
const photo = (token: string, photoId: string) =>
  publicPhotoRoute.GET(new Request(`http://127.0.0.1:3000/r/${token}/photos/${photoId}`), {
    params: Promise.resolve({ token, photoId }),
  } as never);
const notFoundDigest = { digest: expect.stringMatching(/^NEXT_HTTP_ERROR_FALLBACK;404/) };

async function linked() {
  const world = await signedOffJob(new Date('2026-03-10T18:30:00Z'));
  const link = await createReportLink(world.shop.shopId, world.job.id, world.shop.lead.userId);
  return { ...world, link };
}

describe("the customer's link /r/<token>", () => {
  it('stores only the SHA-256 of a 256-bit token that expires after 90 days', async () => {
    const { link } = await linked();
    expect(link.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const [row] = await getDb().select().from(reportLinks).where(eq(reportLinks.id, link.id));
    expect(row!.tokenHash).toBe(tokenHashOf(link.token));
    expect(row!.tokenHash).not.toContain(link.token);
    const days = (row!.expiresAt.getTime() - row!.createdAt.getTime()) / 86_400_000;
    expect(Math.round(days)).toBe(90);
  });

  it('opens the report page, its PDF and its own photos, downscaled in the PDF', async () => {
    const { link, job } = await linked();
    const html = await page(link.token);
    expect(html).toContain('Wren Halloway');
    for (const p of ['LF · Left front', 'RF · Right front', 'LR · Left rear', 'RR · Right rear'])
      expect(html).toContain(p);
    expect(html).toContain(`/r/${link.token}/report.pdf`);

    const res = await pdf(link.token);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toBe(
      `inline; filename="job-${job.number}-report.pdf"`,
    );
    const bytes = Buffer.from(await res.arrayBuffer());
    // Eight 1600×1200 photos go in at 640 px wide: the whole PDF stays far under one original.
    expect(bytes.byteLength).toBeLessThan(JPEG.byteLength * 8);

    const [own] = await getDb()
      .select({ id: wheelPhotos.id })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.jobId, job.id));
    const shown = await photo(link.token, own!.id);
    expect(shown.status).toBe(200);
    expect(Buffer.from(await shown.arrayBuffer()).equals(JPEG)).toBe(true);
  });

  it('refuses an expired, a revoked and a tampered token with the same plain 404', async () => {
    const { link, shop } = await linked();
    const tampered = `${link.token.slice(0, -1)}${link.token.endsWith('A') ? 'B' : 'A'}`;
    for (const token of [tampered, 'short', `${link.token}x`]) {
      await expect(page(token)).rejects.toMatchObject(notFoundDigest);
      expect((await pdf(token)).status).toBe(404);
    }
    const expiring = await linked();
    await getDb()
      .update(reportLinks)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(reportLinks.id, expiring.link.id));
    await expect(page(expiring.link.token)).rejects.toMatchObject(notFoundDigest);
    const expired = await pdf(expiring.link.token);
    expect(expired.status).toBe(404);
    expect(await expired.text()).toBe('Report not found.');

    await revokeReportLink(shop.shopId, link.id, shop.lead.userId);
    await expect(page(link.token)).rejects.toMatchObject(notFoundDigest);
    const revoked = await pdf(link.token);
    expect(revoked.status).toBe(404);
    expect(await revoked.text()).toBe('Report not found.');
  });

  it("reaches nothing else: not another job's photo, not the app's API with the token as a key", async () => {
    const first = await linked();
    const second = await linked();
    const [other] = await getDb()
      .select({ id: wheelPhotos.id })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.jobId, second.job.id));
    expect((await photo(first.link.token, other!.id)).status).toBe(404);

    const asKey = [
      `ringpass_session=${first.link.token}`,
      `ringpass_report=${first.link.token}`,
    ].join('; ');
    const report = await reportRoute.GET(
      apiRequest(`/api/jobs/${first.job.id}/report?token=${first.link.token}`, { cookie: asKey }),
      params({ jobId: first.job.id }),
    );
    expect(report.status).toBe(401);
    const apiPhoto = await photoRoute.GET(
      apiRequest(`/api/photos/${other!.id}?token=${first.link.token}`, { cookie: asKey }),
      params({ photoId: other!.id }),
    );
    expect(apiPhoto.status).toBe(401);
  });

  it('streams a photo to the customer as the store sends it, holding none of it whole', async () => {
    const { link, job } = await linked();
    const [own] = await getDb()
      .select({ id: wheelPhotos.id })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.jobId, job.id));
    // A store that sends the first half of the file, then waits to be let go.
    let letGo = () => {};
    const store = createServer((_req, res) => {
      res.writeHead(200, { 'content-type': 'image/jpeg' });
      res.write(JPEG.subarray(0, JPEG.length >> 1));
      letGo = () => res.end(JPEG.subarray(JPEG.length >> 1));
    }).listen(0, '127.0.0.1');
    await new Promise((r) => store.once('listening', r));
    const before = storeUrl;
    storeUrl = () => `http://127.0.0.1:${(store.address() as AddressInfo).port}/a/app/key`;
    try {
      // Answered while the store still holds the second half: a buffering proxy would wait here.
      const shown = await Promise.race([
        photo(link.token, own!.id),
        new Promise<never>((_, fail) =>
          setTimeout(() => fail(new Error('the photo waited for the whole file')), 5_000),
        ),
      ]);
      expect(shown.status).toBe(200);
      const reader = shown.body!.getReader();
      const first = await reader.read();
      expect(first.value?.byteLength).toBeGreaterThan(0);
      letGo();
      const parts: Uint8Array[] = [first.value!];
      for (let r = await reader.read(); !r.done; r = await reader.read()) parts.push(r.value);
      expect(Buffer.concat(parts).equals(JPEG)).toBe(true);
    } finally {
      letGo();
      storeUrl = before;
      store.close();
    }
  });
});

describe("the customer's photos from a store that fails", () => {
  const firstPhoto = async (jobId: string) =>
    (
      await getDb()
        .select({ id: wheelPhotos.id })
        .from(wheelPhotos)
        .where(eq(wheelPhotos.jobId, jobId))
    )[0]!.id;
  /** A store on loopback answering as `answer` does, for the time of `body`. */
  async function withStore(
    answer: Parameters<typeof createServer>[1],
    body: () => Promise<void>,
  ): Promise<void> {
    const store = createServer(answer).listen(0, '127.0.0.1');
    await new Promise((r) => store.once('listening', r));
    const before = storeUrl;
    storeUrl = () => `http://127.0.0.1:${(store.address() as AddressInfo).port}/a/app/key`;
    try {
      await body();
    } finally {
      storeUrl = before;
      store.closeAllConnections();
      store.close();
    }
  }

  it('answers 404 within about 8 s when the store never answers', async () => {
    const { link, job } = await linked();
    const id = await firstPhoto(job.id);
    await withStore(
      () => {},
      async () => {
        const started = performance.now();
        const shown = await photo(link.token, id);
        expect(shown.status).toBe(404);
        expect(performance.now() - started).toBeLessThan(9_500);
      },
    );
  });

  it('forwards the length the store gives, and stops reading when the customer leaves', async () => {
    const { link, job } = await linked();
    const id = await firstPhoto(job.id);
    let storeLetGo: Promise<void> = Promise.resolve();
    await withStore(
      (_req, res) => {
        storeLetGo = new Promise((r) => res.once('close', () => r()));
        res.writeHead(200, { 'content-type': 'image/jpeg', 'content-length': JPEG.length });
        res.write(JPEG.subarray(0, JPEG.length >> 1));
      },
      async () => {
        const customer = new AbortController();
        const shown = await publicPhotoRoute.GET(
          new Request(`http://127.0.0.1:3000/r/${link.token}/photos/${id}`, {
            signal: customer.signal,
          }),
          { params: Promise.resolve({ token: link.token, photoId: id }) } as never,
        );
        expect(shown.status).toBe(200);
        expect(shown.headers.get('content-length')).toBe(String(JPEG.length));
        customer.abort();
        await expect(storeLetGo).resolves.toBeUndefined();
      },
    );
  });

  it('fails loudly (Next logs it, answers 500) when the store is misconfigured, not as a missing photo', async () => {
    const { link, job } = await linked();
    const id = await firstPhoto(job.id);
    await withGarbledToken(() =>
      expect(photo(link.token, id)).rejects.toThrow('UPLOADTHING_TOKEN is not base64'),
    );
  });
});

describe("the customer's e-mail", () => {
  it('carries the shop, job, vehicle, a working link, the re-check day, the caution line and the PDF', async () => {
    const { shop, job } = await signedOffJob(new Date('2026-03-10T18:30:00Z'));
    const mail = await composeCustomerReportEmail(shop.shopId, job.id);
    expect(mail).not.toBeNull();
    expect(mail!.to).toBe('wren@example.test');
    expect(mail!.subject).toBe(
      `Your completion report: job ${job.number}, 2022 Talonworks Ridgeback (Dustline Test Tires)`,
    );
    const token = /\/r\/([A-Za-z0-9_-]{43})/.exec(mail!.text)?.[1];
    expect(token).toBeDefined();
    expect(mail!.html).toContain(`/r/${token}`);
    expect(await page(token!)).toContain('Wren Halloway');
    for (const body of [mail!.text, mail!.html]) {
      expect(body).toContain('Ring bolt re-check');
      expect(body).toContain('Mar 17, 2026');
      expect(body).toContain('local codes and licensed practice always come first');
    }
    expect(mail!.attachments).toEqual([
      {
        filename: `job-${job.number}-report.pdf`,
        content: expect.any(Buffer),
        contentType: 'application/pdf',
      },
    ]);
    expect(mail!.attachments[0]!.content.subarray(0, 5).toString()).toBe('%PDF-');
  });
});
