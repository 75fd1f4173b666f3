import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import * as reportRoute from '@/app/api/jobs/[jobId]/report/route';
import { renderJobReport } from '@/features/reports/server/render-report';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';
import { signedOffJob } from '@/tests/helpers/report-work';

async function readPdf(pdf: Buffer | Uint8Array) {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const { text, total } = await parser.getText();
    return { text: text.replace(/\s+/g, ' '), pages: total };
  } finally {
    await parser.destroy();
  }
}
const textOf = async (pdf: Buffer | Uint8Array) => (await readPdf(pdf)).text;

const count = (text: string, part: string) => text.split(part).length - 1;
// The shop's default zone is UTC and its re-check days 7 (the shop_settings column defaults).
const SIGNED = new Date('2026-03-10T18:30:00Z');

describe("the job's completion report (PDF)", () => {
  it('holds the customer, each wheel with its final torque and pass settings, the signer and the re-check day', async () => {
    const { shop, job, settings } = await signedOffJob(SIGNED);
    const { pdf, filename } = await renderJobReport(shop.shopId, job.id);
    expect(filename).toBe(`job-${job.number}-report.pdf`);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const { text, pages } = await readPdf(pdf);

    expect(text).toContain('Wren Halloway');
    expect(text).toContain('2022 Talonworks Ridgeback');
    for (const position of [
      'LF · Left front',
      'RF · Right front',
      'LR · Left rear',
      'RR · Right rear',
    ])
      expect(text).toContain(position);
    // 12 ft-lb × 1.355 818 = 16.27 N·m (NIST SP 811 App. B), shown with both units on every wheel.
    expect(count(text, 'Final torque: 12 ft-lb (16.3 N·m)')).toBe(4);
    // Pass targets 3.6, 8.4, 12, 12 ft-lb set on an in-lb wrench (×12, rounded to its 1 in-lb graduation).
    expect(settings).toEqual([43, 101, 144, 144]);
    expect(count(text, 'set to 43 in-lb (3.6 ft-lb)')).toBe(4);
    expect(count(text, 'set to 101 in-lb (8.4 ft-lb)')).toBe(4);
    expect(count(text, 'set to 144 in-lb (12 ft-lb)')).toBe(8);
    expect(text).toContain('Signed off by: Lena Lead, Mar 10, 2026, 6:30 PM');
    expect(text).toContain('Work by: Theo Tech');
    // Sign-off day Mar 10 + 7 re-check days.
    expect(text).toContain('Ring bolt re-check due by Mar 17, 2026');
    expect(text).toContain('Check pass on a freshly torqued ring; I watched every click.');
    expect(text).toContain(
      "The wheel and tire maker's specifications, local codes and licensed practice always come first",
    );
    expect(text).toContain('VALVE');
    // One wheel per page after the summary: a wheel's record never splits from its drawing.
    expect(pages).toBe(4);
  });

  it('names the wrench by serial and its last verification before the sign-off', async () => {
    const { shop, job } = await signedOffJob(SIGNED);
    const text = await textOf((await renderJobReport(shop.shopId, job.id)).pdf);
    expect(text).toContain('Test click 20–200 in-lb (no serial on record)');
    expect(text).toContain('last verified Mar 10, 2026 at 40 in-lb, within tolerance');
  });
});

describe('GET /api/jobs/:id/report', () => {
  const get = async (jobId: string, userId: string) =>
    reportRoute.GET(
      apiRequest(`/api/jobs/${jobId}/report`, { cookie: await cookieFor(userId) }),
      params({ jobId }),
    );

  it("gives the shop's technician the PDF as a download named after the job", async () => {
    const { shop, job } = await signedOffJob(SIGNED);
    const res = await get(job.id, shop.technician.userId);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toBe(
      `attachment; filename="job-${job.number}-report.pdf"`,
    );
    expect(await textOf(new Uint8Array(await res.arrayBuffer()))).toContain('Wren Halloway');
  });

  it('refuses an apprentice, hides the job from another shop, and has no report before sign-off', async () => {
    const { shop, job } = await signedOffJob(SIGNED);
    expect((await get(job.id, shop.apprentice.userId)).status).toBe(403);
    const other = await createTestShop('Other Shop');
    expect((await get(job.id, other.lead.userId)).status).toBe(404);
    const open = await createRecords(shop.lead, shop.technician.userId);
    const res = await get(open.job.id, shop.lead.userId);
    expect(res.status).toBe(409);
    expect(await res.json()).toMatchObject({ error: { code: 'conflict' } });
  });

  it('prints how long a four-wheel report takes to build and the memory it peaks at', async () => {
    const { shop, job } = await signedOffJob(SIGNED);
    await renderJobReport(shop.shopId, job.id); // warm: fonts parsed, modules loaded
    const before = process.memoryUsage().rss;
    let peak = before;
    const sample = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
    const started = performance.now();
    const { pdf } = await renderJobReport(shop.shopId, job.id);
    const ms = performance.now() - started;
    clearInterval(sample);
    peak = Math.max(peak, process.memoryUsage().rss);
    console.info(
      `report build: 4 wheels × 24 bolts × 4 passes, ${ms.toFixed(0)} ms, ${(pdf.byteLength / 1024).toFixed(0)} kB, rss peak ${(peak / 1048576).toFixed(0)} MB (+${((peak - before) / 1048576).toFixed(0)} MB)`,
    );
    expect(ms).toBeLessThan(15_000);
  });
});
