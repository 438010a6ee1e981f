/**
 * The widget's photo pipeline end to end against the real database and the S3 stand-in over HTTP:
 * the endpoints hand out presigned POSTs, the test uploads like a browser, and the server checks,
 * rewrites or refuses what arrived.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import sharp from 'sharp';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { issueFormToken } from '../../src/lib/server/embed/form-token';
import { LeadPhoto } from '../../src/lib/server/photos/lead-photo.entity';
import { attachDraftPhotos, photoLinks, photosOfLead } from '../../src/lib/server/photos/lead-photo.service';
import { getObjectBuffer, headObject } from '../../src/lib/server/storage/s3';
import { POST as requestPhoto } from '../../src/pages/api/embed/[slug]/photos/index';
import { POST as completePhoto } from '../../src/pages/api/embed/[slug]/photos/[id]/complete';
import { DELETE as deletePhoto } from '../../src/pages/api/embed/[slug]/photos/[id]/index';
import { callRoute } from '../helpers/api-route';
import { buildLead } from '../helpers/factories';
import { uploadLikeABrowser } from '../helpers/browser-upload';
import {
  containsOurGpsSeconds,
  elfExecutable,
  htmlPage,
  hugePixelPng,
  sidewaysPhoneJpeg,
  sixteenMegabyteFile,
  smallPng,
  smallWebp,
  svgWithScript,
  truncatedJpeg,
  twelveMegapixelJpeg,
  windowsExecutable,
} from '../helpers/photo-files';

const MiB = 1024 * 1024;
const NOT_A_PHOTO = "This file isn't a photo we can use. JPEG, PNG or WebP, please.";

let orm: MikroORM;
let firm: Company;
let otherFirm: Company;

beforeAll(async () => {
  orm = await getOrm();
  const em = orm.em.fork();
  const suffix = randomBytes(4).toString('hex');
  firm = em.create(Company, { slug: `photo-firm-${suffix}`, name: 'Photo Test Joinery' });
  otherFirm = em.create(Company, { slug: `photo-other-${suffix}`, name: 'Other Test Wallworks' });
  await em.flush();
});

afterAll(async () => {
  await orm.em.fork().nativeDelete(Company, { id: { $in: [firm.id, otherFirm.id] } });
  await orm.close();
});

/** Each test gets its own network address so the per-address limit never couples tests. */
const address = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}-${randomBytes(3).toString('hex')}`;

type FileFacts = { name: string; size: number; type: string };

function widget(company: Company, token = issueFormToken(company.id).token, clientAddress = address()) {
  const slug = company.slug;
  return {
    token,
    request: (file: FileFacts, body: Record<string, unknown> = { formToken: token, ...file }) =>
      callRoute(requestPhoto, { method: 'POST', path: `/api/embed/${slug}/photos`, params: { slug }, body, em: orm.em.fork(), clientAddress }),
    complete: (id: string, formToken = token) =>
      callRoute(completePhoto, {
        method: 'POST',
        path: `/api/embed/${slug}/photos/${id}/complete`,
        params: { slug, id },
        body: { formToken },
        em: orm.em.fork(),
        clientAddress,
      }),
    remove: (id: string, formToken = token) =>
      callRoute(deletePhoto, {
        method: 'DELETE',
        path: `/api/embed/${slug}/photos/${id}`,
        params: { slug, id },
        body: { formToken },
        em: orm.em.fork(),
        clientAddress,
      }),
    /** Request, upload and complete one file; answers every step. */
    async send(bytes: Buffer, { name = 'photo.jpg', type = 'image/jpeg', declaredSize = bytes.length } = {}) {
      const asked = await this.request({ name, size: declaredSize, type });
      expect(asked.status).toBe(201);
      const ticket = (await asked.json()) as { photo: { id: string }; upload: { url: string; fields: Record<string, string> } };
      const uploaded = await uploadLikeABrowser(ticket.upload, bytes, { name, type });
      expect(uploaded.ok).toBe(true);
      const completed = await this.complete(ticket.photo.id);
      return { ticket, completed, body: (await completed.json()) as Record<string, any> };
    },
  };
}

const photoRow = (id: string) => orm.em.fork().findOneOrFail(LeadPhoto, { id });

describe('photos that pass', () => {
  test('a sideways phone photo with GPS comes out upright, at most 2,000 px, with no metadata, and with a thumbnail', async () => {
    const original = await sidewaysPhoneJpeg();
    // The test file really carries what must be removed.
    const before = await sharp(original).metadata();
    expect(before.orientation).toBe(6);
    expect(containsOurGpsSeconds(before.exif!)).toBe(true);

    const { ticket, completed, body } = await widget(firm).send(original, { name: '../../IMG_2231.jpg' });
    expect(completed.status).toBe(200);
    // Stored 3000 × 2000 turned a quarter: 2000 × 3000 upright, fitted to a 2,000 px long edge.
    expect(body.photo).toMatchObject({ id: ticket.photo.id, width: 1333, height: 2000 });
    expect(body.photo.thumbnailUrl).toMatch(/^http/);

    const row = await photoRow(ticket.photo.id);
    expect(row).toMatchObject({ status: 'ready', width: 1333, height: 2000, originalName: 'IMG_2231.jpg', refusal: null });
    // Source: OWASP File Upload Cheat Sheet: storage names are generated, never the client's file name.
    expect(row.uploadKey).toMatch(new RegExp(`^uploads/${firm.id}/[0-9a-f-]{36}/[0-9a-f-]{36}$`));
    expect(row.imageKey).toBe(`photos/${firm.id}/${row.id}.jpg`);
    expect(row.thumbKey).toBe(`thumbs/${firm.id}/${row.id}.jpg`);
    expect(await headObject(row.uploadKey)).toBeNull();

    const image = (await getObjectBuffer(row.imageKey!))!;
    expect(row.bytes).toBe(image.length);
    const after = await sharp(image).metadata();
    expect(after).toMatchObject({ format: 'jpeg', width: 1333, height: 2000 });
    expect(after.exif).toBeUndefined();
    expect(after.xmp).toBeUndefined();
    expect(after.iptc).toBeUndefined();
    expect(after.orientation).toBeUndefined();
    expect(image.includes(Buffer.from('LapwingTestCam'))).toBe(false);

    // Upright means the stored top row (red) is now on the right, the bottom (blue) on the left.
    // Source: EXIF 2.32 Orientation = 6 (see sidewaysPhoneJpeg).
    const pixel = async (x: number, y: number) => [...(await sharp(image).extract({ left: x, top: y, width: 1, height: 1 }).raw().toBuffer())];
    const [leftR, , leftB] = await pixel(100, 1000);
    const [rightR, , rightB] = await pixel(1233, 1000);
    expect(leftB).toBeGreaterThan(200);
    expect(leftR).toBeLessThan(50);
    expect(rightR).toBeGreaterThan(200);
    expect(rightB).toBeLessThan(50);

    const thumbnail = await sharp((await getObjectBuffer(row.thumbKey!))!).metadata();
    expect(thumbnail).toMatchObject({ format: 'jpeg', height: 400 });
    expect(thumbnail.width).toBeGreaterThanOrEqual(266); // 1333 × 400 / 2000 = 266.6, rounded by the resizer
    expect(thumbnail.width).toBeLessThanOrEqual(267);
    expect(thumbnail.exif).toBeUndefined();
  });

  test('PNG (transparent areas turn white) and WebP are accepted and stored as JPEG', async () => {
    const w = widget(firm);
    const png = await w.send(await smallPng({ transparent: true }), { name: 'sketch.png', type: 'image/png' });
    expect(png.completed.status).toBe(200);
    const pngImage = (await getObjectBuffer((await photoRow(png.ticket.photo.id)).imageKey!))!;
    expect((await sharp(pngImage).metadata()).format).toBe('jpeg');
    const [r, g, b] = [...(await sharp(pngImage).extract({ left: 5, top: 5, width: 1, height: 1 }).raw().toBuffer())];
    expect(Math.min(r, g, b)).toBeGreaterThan(240);

    const webp = await w.send(await smallWebp(), { name: 'hall.webp', type: 'image/webp' });
    expect(webp.completed.status).toBe(200);
    expect(webp.body.photo).toMatchObject({ width: 800, height: 600 });
  });

  test('the upload form is bound to one generated key, to image types and to 15 MB', async () => {
    const response = await widget(firm).request({ name: 'wall.jpg', size: 2 * MiB, type: 'image/jpeg' });
    expect(response.status).toBe(201);
    const { photo, upload } = (await response.json()) as { photo: { id: string }; upload: { url: string; fields: Record<string, string> } };
    const row = await photoRow(photo.id);
    expect(row.status).toBe('pending');
    expect(upload.fields.key).toBe(row.uploadKey);
    expect(upload.fields['Content-Type']).toBe('image/jpeg');
    const policy = JSON.parse(Buffer.from(upload.fields.Policy, 'base64').toString('utf8')) as { conditions: unknown[]; expiration: string };
    // Source: AWS S3 docs, "Creating a POST policy": content-length-range [min, max] in bytes, checked by S3.
    expect(policy.conditions).toContainEqual(['content-length-range', 1, 15 * MiB]);
    expect(policy.conditions).toContainEqual(['eq', '$key', row.uploadKey]);
    expect(policy.conditions).toContainEqual(['starts-with', '$Content-Type', 'image/']);
    const minutes = (Date.parse(policy.expiration) - Date.now()) / 60_000;
    expect(minutes).toBeGreaterThan(8);
    expect(minutes).toBeLessThanOrEqual(10);
  });

  // How long this takes is measured by bench/photo-check.bench.ts (`npm run bench photo`), not here.
  test('a 12-megapixel camera original (a browser that could not shrink it) is accepted and fitted to 2,000 px', async () => {
    const w = widget(firm);
    const original = await twelveMegapixelJpeg();
    const asked = (await (await w.request({ name: 'IMG_4000.jpg', size: original.length, type: 'image/jpeg' })).json()) as any;
    expect((await uploadLikeABrowser(asked.upload, original)).ok).toBe(true);
    const completed = await w.complete(asked.photo.id);
    expect(completed.status).toBe(200);
    // 4000 × 3000 fitted to a 2,000 px long edge keeps the 4:3 shape.
    expect(((await completed.json()) as any).photo).toMatchObject({ width: 2000, height: 1500 });
  });

  test('completing twice answers the same photo', async () => {
    const w = widget(firm);
    const first = await w.send(await smallPng(), { name: 'a.png', type: 'image/png' });
    expect(first.completed.status).toBe(200);
    const again = await w.complete(first.ticket.photo.id);
    expect(again.status).toBe(200);
    expect(((await again.json()) as any).photo).toMatchObject({ id: first.ticket.photo.id, width: 640, height: 480 });
  });
});

describe('files that are refused', () => {
  async function expectRefused(bytes: Buffer, file: { name: string; type: string; declaredSize?: number }, message: string | RegExp) {
    const { ticket, completed, body } = await widget(firm).send(bytes, file);
    expect(completed.status).toBe(400);
    expect(body.error).toMatch(message);
    expect(body.fields.photo).toBe(body.error);
    const row = await photoRow(ticket.photo.id);
    expect(row.status).toBe('refused');
    expect(row.refusal).toBe(body.error);
    expect(row.imageKey).toBeNull();
    // Source: OWASP File Upload Cheat Sheet: a refused file is not kept.
    expect(await headObject(row.uploadKey)).toBeNull();
    return row;
  }

  // Source: OWASP File Upload Cheat Sheet: "Validate the file type, don't trust the Content-Type header".
  test('a renamed Linux executable (ELF bytes, .jpg name, image/jpeg) is refused by its content', async () => {
    await expectRefused(elfExecutable(), { name: 'holiday.jpg', type: 'image/jpeg' }, NOT_A_PHOTO);
  });

  test('a renamed Windows executable (MZ bytes, .jpg name) is refused by its content', async () => {
    await expectRefused(windowsExecutable(), { name: 'kitchen.jpg', type: 'image/jpeg' }, NOT_A_PHOTO);
  });

  // Source: OWASP File Upload Cheat Sheet (docs/sources.md §14): SVG is XML that can run script.
  test('an SVG with a script is refused', async () => {
    await expectRefused(svgWithScript, { name: 'wall.svg', type: 'image/svg+xml' }, NOT_A_PHOTO);
  });

  test('an HTML page named .jpg and sent as image/jpeg is refused', async () => {
    await expectRefused(htmlPage, { name: 'photo.jpg', type: 'image/jpeg' }, NOT_A_PHOTO);
  });

  test('a 16 MB file is refused when declared, and again when a smaller declaration hid it', async () => {
    const w = widget(firm);
    const declared = await w.request({ name: 'big.jpg', size: 16 * MiB, type: 'image/jpeg' });
    expect(declared.status).toBe(400);
    expect(await declared.json()).toEqual({
      error: 'Some fields need attention.',
      fields: { size: 'This photo is over 15 MB. Please pick a smaller one.' },
    });

    // The stand-in does not enforce the POST policy (docs/sources.md §15), so the 16 MB upload is
    // stored; the server's own size check after the upload is what refuses it.
    await expectRefused(sixteenMegabyteFile(), { name: 'big.jpg', type: 'image/jpeg', declaredSize: 2 * MiB }, /over 15 MB/);
  });

  test('a photo of more than 40 megapixels is refused', async () => {
    await expectRefused(await hugePixelPng(), { name: 'pano.png', type: 'image/png' }, /more pixels than we can handle/);
  });

  test('a damaged JPEG is refused', async () => {
    await expectRefused(await truncatedJpeg(), { name: 'cut.jpg', type: 'image/jpeg' }, /looks damaged/);
  });

  test('a declared type that is not an image is refused before any upload link is given', async () => {
    const response = await widget(firm).request({ name: 'setup.exe', size: 1000, type: 'application/x-msdownload' });
    expect(response.status).toBe(400);
    expect(((await response.json()) as any).fields).toEqual({ type: NOT_A_PHOTO });
  });
});

describe('limits and removal', () => {
  test('an eleventh photo is refused; refused and removed photos give their place back', async () => {
    const w = widget(firm);
    const ids: string[] = [];
    for (let i = 0; i < 10; i++) {
      const response = await w.request({ name: `wall-${i}.jpg`, size: 1000, type: 'image/jpeg' });
      expect(response.status).toBe(201);
      ids.push(((await response.json()) as any).photo.id);
    }
    const eleventh = await w.request({ name: 'wall-10.jpg', size: 1000, type: 'image/jpeg' });
    expect(eleventh.status).toBe(400);
    expect(await eleventh.json()).toEqual({ error: 'You can add up to 10 photos.', fields: { photo: 'You can add up to 10 photos.' } });

    // Completing one with nothing uploaded leaves it pending (the browser may retry the upload).
    const early = await w.complete(ids[0]);
    expect(early.status).toBe(400);
    expect(((await early.json()) as any).error).toMatch(/did not receive/);
    expect((await photoRow(ids[0])).status).toBe('pending');

    expect((await w.remove(ids[0])).status).toBe(204);
    expect((await w.request({ name: 'again.jpg', size: 1000, type: 'image/jpeg' })).status).toBe(201);
    expect((await w.request({ name: 'one-more.jpg', size: 1000, type: 'image/jpeg' })).status).toBe(400);
  });

  test('ten requests at once for a draft with nine photos let exactly one through', async () => {
    const w = widget(firm);
    for (let i = 0; i < 9; i++) expect((await w.request({ name: `p${i}.jpg`, size: 1000, type: 'image/jpeg' })).status).toBe(201);
    const answers = await Promise.all(Array.from({ length: 10 }, (_, i) => w.request({ name: `race${i}.jpg`, size: 1000, type: 'image/jpeg' })));
    expect(answers.map((a) => a.status).sort()).toEqual([201, ...Array(9).fill(400)]);
  });

  test('a photo removed before sending is gone from storage and from the draft', async () => {
    const w = widget(firm);
    const { ticket, completed } = await w.send(await smallPng(), { name: 'keep-not.png', type: 'image/png' });
    expect(completed.status).toBe(200);
    const row = await photoRow(ticket.photo.id);
    expect(await headObject(row.imageKey!)).not.toBeNull();

    expect((await w.remove(ticket.photo.id)).status).toBe(204);
    expect(await orm.em.fork().findOne(LeadPhoto, { id: ticket.photo.id })).toBeNull();
    expect(await headObject(row.imageKey!)).toBeNull();
    expect(await headObject(row.thumbKey!)).toBeNull();
    expect((await w.remove(ticket.photo.id)).status).toBe(404);
  });

  test('too many photo calls from one address get 429 with Retry-After', async () => {
    const w = widget(firm, undefined, address());
    const statuses: number[] = [];
    for (let i = 0; i < 121; i++) statuses.push((await w.remove('not-a-photo-id')).status);
    expect(statuses.slice(0, 120).every((s) => s === 404)).toBe(true);
    const last = await w.remove('not-a-photo-id');
    expect(last.status).toBe(429);
    expect(Number(last.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(((await last.json()) as any).error).toMatch(/Too many photo uploads/);
  });

  test('bad requests get field-level JSON errors, never a 500', async () => {
    const w = widget(firm);
    const missing = await w.request({ name: 'x.jpg', size: 0, type: 'image/jpeg' }, { formToken: w.token, name: 'x.jpg' });
    expect(missing.status).toBe(400);
    expect(((await missing.json()) as any).fields).toMatchObject({ size: 'The file size is missing.', type: 'The file type is missing.' });

    const extra = await w.request(
      { name: 'x.jpg', size: 10, type: 'image/jpeg' },
      { formToken: w.token, name: 'x.jpg', size: 10, type: 'image/jpeg', companyId: otherFirm.id },
    );
    expect(extra.status).toBe(400);

    const notJson = await callRoute(requestPhoto, {
      method: 'POST',
      path: `/api/embed/${firm.slug}/photos`,
      params: { slug: firm.slug },
      em: orm.em.fork(),
      body: 'formToken=x',
      headers: { 'content-type': 'text/plain' },
      clientAddress: address(),
    });
    expect(notJson.status).toBe(415);

    const forged = await w.request(
      { name: 'x.jpg', size: 10, type: 'image/jpeg' },
      { formToken: `${w.token.split('.')[0]}.AAAA`, name: 'x.jpg', size: 10, type: 'image/jpeg' },
    );
    expect(forged.status).toBe(400);
    expect(((await forged.json()) as any).fields.formToken).toMatch(/reload the page/);
  });
});

describe('other firms and other drafts', () => {
  test('an unknown firm is 404; another firm’s form token is refused', async () => {
    const unknown = await callRoute(requestPhoto, {
      method: 'POST',
      path: '/api/embed/no-such-firm-here/photos',
      params: { slug: 'no-such-firm-here' },
      em: orm.em.fork(),
      body: { formToken: issueFormToken(firm.id).token, name: 'a.jpg', size: 10, type: 'image/jpeg' },
      clientAddress: address(),
    });
    expect(unknown.status).toBe(404);
    expect(await unknown.json()).toEqual({ error: 'No firm at this address.' });

    const foreignToken = issueFormToken(otherFirm.id).token;
    const response = await widget(firm, foreignToken).request({ name: 'a.jpg', size: 10, type: 'image/jpeg' });
    expect(response.status).toBe(400);
    expect(((await response.json()) as any).fields.formToken).toBe('This form belongs to another page. Please reload.');
  });

  test('another firm or another draft cannot complete, see or remove a photo: 404', async () => {
    const owner = widget(firm);
    const { ticket, completed } = await owner.send(await smallPng(), { name: 'mine.png', type: 'image/png' });
    expect(completed.status).toBe(200);
    const id = ticket.photo.id;

    // Another firm, with its own valid token, on its own address.
    const stranger = widget(otherFirm);
    expect((await stranger.complete(id)).status).toBe(404);
    expect((await stranger.remove(id)).status).toBe(404);
    // Another homeowner of the same firm (another draft).
    const neighbour = widget(firm);
    expect((await neighbour.complete(id)).status).toBe(404);
    expect((await neighbour.remove(id)).status).toBe(404);
    // Ids that are not UUIDs never reach the database.
    expect((await owner.complete("1' or '1'='1")).status).toBe(404);

    expect((await photoRow(id)).status).toBe('ready');
    expect(await photosOfLead(orm.em.fork(), { companyId: otherFirm.id, leadId: randomUUID() })).toEqual([]);
  });
});

describe('sending the lead and staff links', () => {
  /** Creates a lead the way the lead service does, inside a transaction, and attaches the draft's photos. */
  async function sendLead(companyId: string, draftId: string) {
    return orm.em.fork().transactional(async (tx) => {
      const lead = buildLead(tx, companyId, { draftId });
      const attached = await attachDraftPhotos(tx, { companyId, draftId, lead });
      await tx.flush();
      return { lead, attached };
    });
  }

  test('the lead takes its draft’s ready photos in its own transaction; sent photos can no longer be removed', async () => {
    const { token, draftId } = issueFormToken(firm.id);
    const w = widget(firm, token);
    const ready = await w.send(await smallPng(), { name: 'ready.png', type: 'image/png' });
    const refused = await w.send(htmlPage, { name: 'nope.jpg', type: 'image/jpeg' });
    expect(refused.completed.status).toBe(400);
    // Another draft's photo stays where it is.
    const elsewhere = await widget(firm).send(await smallPng(), { name: 'other.png', type: 'image/png' });

    const { lead, attached } = await sendLead(firm.id, draftId);
    expect(attached.map((p) => p.id)).toEqual([ready.ticket.photo.id]);
    expect((await photosOfLead(orm.em.fork(), { companyId: firm.id, leadId: lead.id })).map((p) => p.id)).toEqual([ready.ticket.photo.id]);
    expect(await photosOfLead(orm.em.fork(), { companyId: otherFirm.id, leadId: lead.id })).toEqual([]);
    expect((await photoRow(elsewhere.ticket.photo.id)).lead).toBeNull();

    const remove = await w.remove(ready.ticket.photo.id);
    expect(remove.status).toBe(409);

    // A photo still on its way when the lead was sent joins the lead when its check finishes.
    const late = await w.send(await smallWebp(), { name: 'late.webp', type: 'image/webp' });
    expect(late.completed.status).toBe(200);
    const lateRow = await orm.em.fork().findOneOrFail(LeadPhoto, { id: late.ticket.photo.id });
    expect(lateRow.lead?.id).toBe(lead.id);
  });

  test('staff links are short-lived and serve the photo as an inline JPEG', async () => {
    const { ticket } = await widget(firm).send(await sidewaysPhoneJpeg({ width: 600, height: 400 }), { name: 'x.jpg' });
    const photo = await photoRow(ticket.photo.id);
    const links = (await photoLinks(photo))!;
    const expiresInMinutes = (links.expiresAt.getTime() - Date.now()) / 60_000;
    expect(expiresInMinutes).toBeGreaterThan(9);
    expect(expiresInMinutes).toBeLessThanOrEqual(10);
    for (const url of [links.imageUrl, links.thumbnailUrl]) {
      const signed = new URL(url);
      expect(signed.searchParams.get('X-Amz-Expires')).toBe('600');
      expect(signed.searchParams.get('response-content-type')).toBe('image/jpeg');
      expect(signed.searchParams.get('response-content-disposition')).toBe('inline');
      const response = await fetch(url);
      expect(response.status).toBe(200);
      expect(response.headers.get('content-type')).toBe('image/jpeg');
      expect(response.headers.get('content-disposition')).toBe('inline');
      expect((await sharp(Buffer.from(await response.arrayBuffer())).metadata()).exif).toBeUndefined();
    }
    expect(await photoLinks(Object.assign(new LeadPhoto(), { status: 'pending' }))).toBeNull();
  });
});
