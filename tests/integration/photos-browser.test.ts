/**
 * The photo picker in a real browser (Debian's Chromium), uploading through the real endpoints to
 * the S3 stand-in: the browser shrinks and turns the photo, shows progress and refusals, retries
 * after a dropped connection, removes, and stops at ten.
 */
import { existsSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { chromium, type Browser, type Page } from 'playwright-core';
import AxeBuilder from '@axe-core/playwright';
import sharp from 'sharp';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { issueFormToken } from '../../src/lib/server/embed/form-token';
import { LeadPhoto } from '../../src/lib/server/photos/lead-photo.entity';
import { getObjectBuffer } from '../../src/lib/server/storage/s3';
import { POST as requestPhoto } from '../../src/pages/api/embed/[slug]/photos/index';
import { POST as completePhoto } from '../../src/pages/api/embed/[slug]/photos/[id]/complete';
import { DELETE as deletePhoto } from '../../src/pages/api/embed/[slug]/photos/[id]/index';
import { startIslandHarness, type Harness } from '../helpers/island-harness';
import { elfExecutable, sidewaysPhoneJpeg, smallPng, svgWithScript } from '../helpers/photo-files';

const CHROMIUM = '/usr/bin/chromium';

let orm: MikroORM;
let firm: Company;
let harness: Harness;
let browser: Browser;

beforeAll(async () => {
  orm = await getOrm();
  const em = orm.em.fork();
  firm = em.create(Company, { slug: `photo-browser-${randomBytes(4).toString('hex')}`, name: 'Browser Test Trim' });
  await em.flush();
  harness = await startIslandHarness({
    entrySource: `
      import { createRoot } from 'react-dom/client';
      import PhotoPicker from '../../src/components/widget/PhotoPicker';
      const query = new URLSearchParams(location.search);
      window.pickedPhotos = [];
      createRoot(document.getElementById('root')).render(
        <PhotoPicker slug={query.get('slug')} formToken={query.get('token')} onChange={(photos) => { window.pickedPhotos = photos; }} />,
      );`,
    routes: [
      { method: 'POST', pattern: /^\/api\/embed\/([^/]+)\/photos$/, handler: requestPhoto, params: (m) => ({ slug: m[1] }) },
      { method: 'POST', pattern: /^\/api\/embed\/([^/]+)\/photos\/([^/]+)\/complete$/, handler: completePhoto, params: (m) => ({ slug: m[1], id: m[2] }) },
      { method: 'DELETE', pattern: /^\/api\/embed\/([^/]+)\/photos\/([^/]+)$/, handler: deletePhoto, params: (m) => ({ slug: m[1], id: m[2] }) },
    ],
    em: () => orm.em.fork(),
    clientAddress: `203.0.113.${Math.floor(Math.random() * 250) + 1}`,
  });
  browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
}, 60_000);

afterAll(async () => {
  await browser?.close();
  await harness?.close();
  await orm.em.fork().nativeDelete(Company, { id: firm.id });
  await orm.close();
});

/** A fresh widget page with its own draft, at the narrowest common phone width. */
async function openPicker(): Promise<{ page: Page; draftId: string; finish: () => Promise<void> }> {
  const { token, draftId } = issueFormToken(firm.id);
  const context = await browser.newContext({ viewport: { width: 320, height: 640 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  const finish = async () => {
    await context.close();
    expect(errors).toEqual([]);
  };
  await page.goto(`${harness.origin}/?${new URLSearchParams({ slug: firm.slug, token })}`);
  await page.getByRole('button', { name: 'Add photos' }).waitFor();
  return { page, draftId, finish };
}

const rowOf = (page: Page, name: string) => page.getByRole('listitem').filter({ hasText: name });

describe.skipIf(!existsSync(CHROMIUM))('the photo picker in a browser', () => {
  test('a sideways phone photo is shrunk and turned in the browser, uploaded, checked and shown; an SVG and a renamed program are refused', async () => {
    const { page, draftId, finish } = await openPicker();
    await page.locator('input[type=file]').setInputFiles([
      { name: 'living-room.jpg', mimeType: 'image/jpeg', buffer: await sidewaysPhoneJpeg({ width: 4000, height: 3000 }) },
      { name: 'plan.svg', mimeType: 'image/svg+xml', buffer: svgWithScript },
      { name: 'holiday.jpg', mimeType: 'image/jpeg', buffer: elfExecutable() },
    ]);

    await expect.poll(() => rowOf(page, 'living-room.jpg').textContent(), { timeout: 15_000 }).toContain('Added.');
    await expect
      .poll(() => rowOf(page, 'plan.svg').textContent(), { timeout: 10_000 })
      .toContain("This file isn't a photo we can use. JPEG, PNG or WebP, please.");
    await expect
      .poll(() => rowOf(page, 'holiday.jpg').textContent(), { timeout: 10_000 })
      .toContain("This file isn't a photo we can use. JPEG, PNG or WebP, please.");

    const picked = await page.evaluate(() => (window as unknown as { pickedPhotos: { id: string; thumbnailUrl: string }[] }).pickedPhotos);
    expect(picked).toHaveLength(1);
    // The thumbnail shown is the server's, loaded from storage through a signed link.
    const shown = rowOf(page, 'living-room.jpg').locator('img');
    expect(await shown.getAttribute('src')).toBe(picked[0].thumbnailUrl);
    await expect.poll(() => shown.evaluate((img: HTMLImageElement) => img.naturalWidth)).toBeGreaterThan(0);

    // 4000 × 3000 stored sideways: the browser turned it upright and shrank it to 1500 × 2000.
    const row = await orm.em.fork().findOneOrFail(LeadPhoto, { id: picked[0].id, company: firm.id, draftId });
    expect(row).toMatchObject({ status: 'ready', width: 1500, height: 2000 });
    const stored = await sharp((await getObjectBuffer(row.imageKey!))!).metadata();
    expect(stored.exif).toBeUndefined();
    // Source: EXIF 2.32 Orientation 6: the stored top (red) shows on the right.
    const [r, , b] = [
      ...(await sharp((await getObjectBuffer(row.imageKey!))!)
        .extract({ left: 1400, top: 1000, width: 1, height: 1 })
        .raw()
        .toBuffer()),
    ];
    expect(r).toBeGreaterThan(200);
    expect(b).toBeLessThan(60);

    // No accessibility violations in the filled-in picker, contrast included (the page around it is a bare harness).
    const audit = await new AxeBuilder({ page }).disableRules(['page-has-heading-one']).analyze();
    expect(audit.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);

    // Removing takes it off the list, off the form and out of the database.
    await page.getByRole('button', { name: 'Remove living-room.jpg' }).click();
    await expect.poll(() => rowOf(page, 'living-room.jpg').count()).toBe(0);
    await expect.poll(() => page.evaluate(() => (window as unknown as { pickedPhotos: unknown[] }).pickedPhotos.length)).toBe(0);
    expect(await orm.em.fork().findOne(LeadPhoto, { id: picked[0].id })).toBeNull();
    await expect.poll(() => page.getByRole('status').textContent()).toBe('living-room.jpg removed.');
    await finish();
  }, 60_000);

  test('an upload cut off by the network can be tried again', async () => {
    const { page, draftId, finish } = await openPicker();
    const s3Origin = new URL(process.env.S3_ENDPOINT!).origin;
    await page.route(`${s3Origin}/**`, (route) => (route.request().method() === 'POST' ? route.abort('connectionreset') : route.continue()));
    await page.locator('input[type=file]').setInputFiles([{ name: 'hallway.png', mimeType: 'image/png', buffer: await smallPng() }]);
    await expect.poll(() => rowOf(page, 'hallway.png').textContent(), { timeout: 10_000 }).toContain('The connection dropped');

    await page.unroute(`${s3Origin}/**`);
    await page.getByRole('button', { name: 'Try again hallway.png' }).click();
    await expect.poll(() => rowOf(page, 'hallway.png').textContent(), { timeout: 10_000 }).toContain('Added.');
    // The interrupted attempt's place was given back: one photo in the draft, not two.
    const photos = await orm.em.fork().find(LeadPhoto, { company: firm.id, draftId });
    expect(photos.map((p) => `${p.originalName}:${p.status}`)).toEqual(['hallway.png:ready']);
    await finish();
  }, 60_000);

  test('picking eleven photos takes ten and says which one was left out', async () => {
    const { page, finish } = await openPicker();
    const png = await smallPng();
    const files = Array.from({ length: 11 }, (_, i) => ({ name: `wall-${String(i + 1).padStart(2, '0')}.png`, mimeType: 'image/png', buffer: png }));
    await page.locator('input[type=file]').setInputFiles(files);
    await expect.poll(() => page.getByText('You can add up to 10 photos. We left out wall-11.png.').count()).toBe(1);
    await expect.poll(() => page.getByRole('list', { name: 'Your photos' }).getByRole('listitem').count()).toBe(10);
    await expect.poll(() => page.getByRole('button', { name: 'Add more photos' }).isDisabled()).toBe(true);
    await expect.poll(() => page.getByText('Added.').count(), { timeout: 20_000 }).toBe(10);
    await finish();
  }, 60_000);
});
