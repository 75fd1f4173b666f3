import path from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { PDFParse } from 'pdf-parse';
import { toString as renderQr } from 'qrcode';
import { ROOT } from '../helpers/test-services';
import { inviteAndJoin, PASSWORD, signUp, uniqueEmail } from './helpers';

/** A same-origin API call with the page's session, as the app itself would make it. */
async function api<T>(page: Page, method: 'GET' | 'POST', path: string, body?: unknown) {
  const origin = new URL(page.url()).origin;
  const res = await page.request.fetch(path, {
    method,
    data: body,
    headers: { origin, 'content-type': 'application/json' },
  });
  expect(res.ok(), `${method} ${path}: ${await res.text()}`).toBe(true);
  return ((await res.json()) as { data: T }).data;
}

type Job = { id: string; number: number; wheels: { id: string; position: string }[] };
const POSITIONS = { LF: 'Left front', RF: 'Right front', LR: 'Left rear', RR: 'Right rear' };

/** The dark modules' path of the QR symbol for `url`, drawn as the server draws it. */
async function qrPathFor(url: string) {
  const svg = await renderQr(url, { type: 'svg', errorCorrectionLevel: 'M' });
  return /<path stroke="#000000" d="([^"]+)"/.exec(svg)![1];
}

/** jsQR's global, as its browser build defines it. */
type JsQr = (data: Uint8ClampedArray, width: number, height: number) => { data: string } | null;

async function pagesOf(pdf: Buffer) {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).pages.map((p) => p.text);
  } finally {
    await parser.destroy();
  }
}

test('the printed job card shows each wheel with its spec and a QR code; scanned signed out, it leads through sign-in back to that wheel’s runner', async ({
  page,
  browser,
  baseURL,
}) => {
  test.setTimeout(120_000);
  await signUp(page, 'Papercut Beadlocks', 'Lena Lead', uniqueEmail('lead'));
  const techEmail = uniqueEmail('tech');
  const tech = await inviteAndJoin(page, browser, techEmail, 'Pia Print', 'Technician');
  await tech.context.close();
  const techId = (await api<{ id: string; name: string }[]>(page, 'GET', '/api/team/members')).find(
    (m) => m.name === 'Pia Print',
  )!.id;
  const spec = await api<{ id: string }>(page, 'POST', '/api/specs', {
    name: '20-bolt dune ring',
    boltCount: 20,
    boltThread: 'M8×1.25',
    finalTorque: 14,
    torqueUnit: 'lbf-ft',
    passPercents: [30, 70, 100],
    patternKind: 'cross',
    checkPass: true,
    maxBeadSeatPressure: 30,
    runningPressure: 14,
    pressureUnit: 'psi',
    makerReference: 'Dune ring sheet 7, rev. B',
  });
  const job = await api<Job>(page, 'POST', '/api/jobs', {
    customer: { name: 'Orla Quarry', phone: '555-0177', email: '' },
    vehicle: { make: 'Boreal', model: 'Scout', description: '' },
    wheels: Object.keys(POSITIONS).map((position) => ({
      position,
      specId: spec.id,
      tireSize: '32x10R15',
      directional: true,
      targetPressure: 12,
      pressureUnit: 'psi',
    })),
    dismount: true,
    reinstall: true,
    assigneeId: techId,
    dueAt: new Date(Date.now() + 26 * 3_600_000).toISOString(),
  });

  await page.goto(`/jobs/${job.id}`);
  const printButton = page.getByRole('button', { name: 'Print job card' });
  await expect(printButton).toBeVisible();
  // On screen the paper card stays out of the way.
  await expect(page.getByRole('heading', { name: `Job card #${job.number}` })).toBeHidden();

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('heading', { name: `Job card #${job.number}` })).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
  await expect(printButton).toBeHidden();
  await expect(page.getByRole('link', { name: '← Board' })).toBeHidden();
  for (const button of await page.getByRole('button').all()) await expect(button).toBeHidden();
  const printed = page.getByRole('region', { name: `Job card #${job.number}` });
  await expect(printed.getByText('Orla Quarry · 555-0177')).toBeVisible();

  const runnerUrls = new Map<string, string>();
  for (const [position, label] of Object.entries(POSITIONS)) {
    const wheel = job.wheels.find((w) => w.position === position)!;
    const card = printed.getByRole('article', { name: `${position} · ${label}` });
    await expect(card).toBeVisible();
    await expect(card).toContainText('20-bolt dune ring');
    await expect(card).toContainText('20 × M8×1.25, cross pattern');
    await expect(card).toContainText('14 ft-lb');
    await expect(card).toContainText('Dune ring sheet 7, rev. B');
    await expect(card).toContainText('32x10R15 · directional');
    await expect(card).toContainText('12 psi target');
    const code = card.getByRole('img', {
      name: `QR code: opens the runner for the ${label.toLowerCase()} wheel`,
    });
    await expect(code.locator('svg')).toBeVisible();
    // The code is exactly the symbol for this wheel's runner on the app's public address.
    const url = `${baseURL}/jobs/${job.id}/wheels/${wheel.id}/run`;
    expect(await code.locator('svg path[stroke]').getAttribute('d')).toBe(await qrPathFor(url));
    runnerUrls.set(position, url);
  }

  // Scanned for real: each printed symbol, drawn to a canvas as a camera would see it, decodes to
  // its own wheel's runner address.
  await page.addScriptTag({ path: path.join(ROOT, 'node_modules', 'jsqr', 'dist', 'jsQR.js') });
  for (const [position, label] of Object.entries(POSITIONS)) {
    const svg = printed
      .getByRole('article', { name: `${position} · ${label}` })
      .getByRole('img', { name: /^QR code:/ })
      .locator('svg');
    const decoded = await svg.evaluate(async (el) => {
      const scale = 4;
      const box = el.getBoundingClientRect();
      const image = new Image();
      image.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(new XMLSerializer().serializeToString(el))}`;
      await image.decode();
      const canvas = document.createElement('canvas');
      canvas.width = Math.ceil(box.width * scale);
      canvas.height = Math.ceil(box.height * scale);
      const g = canvas.getContext('2d')!;
      g.fillStyle = '#fff';
      g.fillRect(0, 0, canvas.width, canvas.height);
      g.drawImage(image, 0, 0, canvas.width, canvas.height);
      const { data, width, height } = g.getImageData(0, 0, canvas.width, canvas.height);
      const jsQR = (window as unknown as { jsQR: JsQr }).jsQR;
      return jsQR(data, width, height)?.data ?? null;
    });
    expect(decoded, `${position} QR`).toBe(runnerUrls.get(position));
  }

  // Four wheels fit one sheet of either paper; each page's text holds whole cards.
  for (const format of ['A4', 'Letter'] as const) {
    const pages = await pagesOf(await page.pdf({ format, printBackground: true }));
    expect(pages, `${format}: one page`).toHaveLength(1);
    for (const position of Object.keys(POSITIONS)) expect(pages[0]).toContain(`${position} ·`);
  }

  // A phone that is not signed in scans the right-rear code: sign in, then that wheel's runner,
  // not the technician's usual first page (My wheels).
  const phone = await browser.newContext();
  const scan = await phone.newPage();
  const rr = runnerUrls.get('RR')!;
  await scan.goto(rr);
  await expect(scan).toHaveURL(/\/sign-in\?next=/);
  await scan.getByLabel('E-mail').fill(techEmail);
  await scan.getByLabel('Password').fill(PASSWORD);
  await scan.getByRole('button', { name: 'Sign in' }).click();
  await expect(scan).toHaveURL(rr);
  await expect(scan.getByRole('heading', { name: /Safety gate/ })).toBeVisible();
  await phone.close();
});
