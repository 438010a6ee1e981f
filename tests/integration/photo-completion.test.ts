/**
 * Completing a photo upload, watched from the outside: the app's storage goes through a proxy in
 * front of the S3 stand-in that records every request and, at the moment one arrives, looks at
 * the database (is a transaction open?) or changes the stored object. The database is this file's
 * own, so every session on it belongs to this test.
 */
import { createHash, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import pg from 'pg';
import { Company } from '../../src/lib/server/companies/company.entity';
import { InvalidInput } from '../../src/lib/server/errors';
import { LeadPhoto } from '../../src/lib/server/photos/lead-photo.entity';
import { completeUpload, requestUpload } from '../../src/lib/server/photos/lead-photo.service';
import { uploadLikeABrowser } from '../helpers/browser-upload';
import { openMigratedDatabase } from '../helpers/migrated-database';
import { htmlPage, smallPng, smallWebp } from '../helpers/photo-files';
import { startStorageProxy, type StorageProxy, type StorageRequest } from '../helpers/storage-proxy';

const NOT_RECEIVED = 'We did not receive this photo. Please try again.';

let orm: MikroORM;
let url: string;
let closeDatabase: () => Promise<void>;
let proxy: StorageProxy;
let standIn: string;
let firm: Company;
let watcher: pg.Client;

beforeAll(async () => {
  standIn = process.env.S3_ENDPOINT!;
  proxy = await startStorageProxy(standIn, process.env.S3_BUCKET!);
  // Before this file's first storage call, which creates the client.
  process.env.S3_ENDPOINT = proxy.endpoint;
  ({ orm, url, close: closeDatabase } = await openMigratedDatabase());
  const em = orm.em.fork();
  firm = em.create(Company, { slug: 'completion-firm', name: 'Completion Test Joinery' });
  await em.flush();
  watcher = new pg.Client({ connectionString: url });
  await watcher.connect();
});

afterAll(async () => {
  await watcher?.end();
  await closeDatabase?.();
  await proxy?.close();
});

/** Sessions on this database (other than the watcher's own) that are inside a transaction. */
async function openTransactions(): Promise<number> {
  const { rows } = await watcher.query<{ n: number }>(
    `select count(*)::int as n from pg_stat_activity
      where datname = current_database() and backend_type = 'client backend' and pid <> pg_backend_pid() and xact_start is not null`,
  );
  return rows[0]!.n;
}

/** A pending photo under a fresh draft, and its upload form. */
async function newUpload(bytes: Buffer, type = 'image/png') {
  const draftId = randomUUID();
  const { photo, upload } = await requestUpload(orm.em.fork(), { companyId: firm.id, draftId, name: 'wall.png', size: bytes.length, type });
  return { ref: { companyId: firm.id, draftId, photoId: photo.id }, uploadKey: photo.uploadKey, upload };
}

/** The app's storage requests while `work` runs (browser uploads left out). */
async function storageRequestsDuring(work: () => Promise<unknown>): Promise<StorageRequest[]> {
  const from = proxy.requests.length;
  await work().catch(() => {});
  return proxy.requests.slice(from).filter((r) => r.method !== 'POST');
}

const refusalOf = (call: Promise<unknown>): Promise<InvalidInput> =>
  call.then(
    () => {
      throw new Error('expected a refusal');
    },
    (error: InvalidInput) => error,
  );

const row = (id: string) => orm.em.fork().findOneOrFail(LeadPhoto, { id });

describe('completing an upload holds no transaction through storage and image work', () => {
  test('no transaction is open while the upload is read, the image re-encoded and the copies written', async () => {
    const { ref, uploadKey, upload } = await newUpload(await smallPng());
    expect((await uploadLikeABrowser(upload, await smallPng(), { type: 'image/png' })).ok).toBe(true);

    const seen: { method: string; key: string; open: number }[] = [];
    proxy.before = async (request) => {
      if (request.method !== 'POST') seen.push({ method: request.method, key: request.key, open: await openTransactions() });
    };
    try {
      const photo = await completeUpload(orm.em.fork(), ref);
      expect(photo).toMatchObject({ status: 'ready', width: 640, height: 480 });
    } finally {
      proxy.before = undefined;
    }
    expect(seen.map((s) => `${s.method} ${s.key}`)).toEqual([
      `HEAD ${uploadKey}`,
      `GET ${uploadKey}`,
      `PUT photos/${firm.id}/${ref.photoId}.jpg`,
      `PUT thumbs/${firm.id}/${ref.photoId}.jpg`,
      `DELETE ${uploadKey}`,
    ]);
    expect(seen.map((s) => s.open)).toEqual([0, 0, 0, 0, 0]);
  });

  test('two completes at once end with one result, one check and one write', async () => {
    const { ref, uploadKey, upload } = await newUpload(await smallPng());
    await uploadLikeABrowser(upload, await smallPng(), { type: 'image/png' });
    let answers: LeadPhoto[] = [];
    const requests = await storageRequestsDuring(async () => {
      answers = await Promise.all([completeUpload(orm.em.fork(), ref), completeUpload(orm.em.fork(), ref)]);
    });
    expect(answers.map((p) => [p.id, p.status, p.width, p.height])).toEqual([
      [ref.photoId, 'ready', 640, 480],
      [ref.photoId, 'ready', 640, 480],
    ]);
    expect(requests.filter((r) => r.method === 'HEAD' && r.key === uploadKey)).toHaveLength(1);
    expect(requests.filter((r) => r.method === 'PUT' && r.key.startsWith('photos/'))).toHaveLength(1);
  });

  test('two completes of a refused file both get the same refusal', async () => {
    const { ref, upload } = await newUpload(htmlPage, 'image/jpeg');
    await uploadLikeABrowser(upload, htmlPage, { type: 'image/jpeg' });
    const [a, b] = await Promise.all([refusalOf(completeUpload(orm.em.fork(), ref)), refusalOf(completeUpload(orm.em.fork(), ref))]);
    expect(a.fields).toEqual({ photo: "This file isn't a photo we can use. JPEG, PNG or WebP, please." });
    expect(b.fields).toEqual(a.fields);
    expect((await row(ref.photoId)).status).toBe('refused');
  });

  test('a check whose process died is taken over once its claim has lapsed', async () => {
    const { ref, upload } = await newUpload(await smallPng());
    await uploadLikeABrowser(upload, await smallPng(), { type: 'image/png' });
    // As a crashed check leaves it: claimed, with a deadline already past.
    await orm.em.fork().nativeUpdate(LeadPhoto, { id: ref.photoId }, { status: 'checking', checkingUntil: new Date(Date.now() - 1000) });
    const photo = await completeUpload(orm.em.fork(), ref);
    expect(photo).toMatchObject({ status: 'ready', checkingUntil: null });
  });
});

describe('only the object at the signed key is accepted', () => {
  // The stand-in enforces no POST policy: it stores a file under whatever key the form names
  // (even `../` paths, outside the bucket). Real S3 refuses a key the policy does not allow
  // (Source: AWS S3 docs, "Creating a POST policy": condition ["eq", "$key", …]).
  test('a file posted under another key than the signed one is not taken, and no other key is read', async () => {
    const { ref, uploadKey, upload } = await newUpload(await smallPng());
    for (const key of [`${uploadKey}.jpg`, `${uploadKey}/photo.jpg`]) {
      const posted = await uploadLikeABrowser({ url: upload.url, fields: { ...upload.fields, key } }, await smallPng(), { type: 'image/png' });
      expect(posted.ok).toBe(true);
    }
    let refusal: InvalidInput | undefined;
    const requests = await storageRequestsDuring(async () => {
      refusal = await refusalOf(completeUpload(orm.em.fork(), ref));
    });
    expect(refusal!.fields).toEqual({ photo: NOT_RECEIVED });
    expect(requests.map((r) => `${r.method} ${r.key}`)).toEqual([`HEAD ${uploadKey}`]);
    // Still pending: the browser may upload again to the right key.
    expect((await row(ref.photoId)).status).toBe('pending');
  });

  test('the bytes checked are those whose size was checked: an object replaced between the two reads is not used', async () => {
    const first = await smallPng();
    const { ref, uploadKey, upload } = await newUpload(first);
    await uploadLikeABrowser(upload, first, { type: 'image/png' });

    // Right after the app's HEAD, another file takes the key (a second post of the same form).
    const replacement = await smallWebp();
    proxy.after = async (request) => {
      if (request.method === 'HEAD' && request.key === uploadKey) {
        proxy.after = undefined;
        const put = await fetch(`${standIn}/${process.env.S3_BUCKET}/${uploadKey}`, {
          method: 'PUT',
          body: Uint8Array.from(replacement),
          headers: { 'content-type': 'image/webp' },
        });
        expect(put.ok).toBe(true);
      }
    };
    let refusal: InvalidInput | undefined;
    const requests = await storageRequestsDuring(async () => {
      refusal = await refusalOf(completeUpload(orm.em.fork(), ref));
    });
    proxy.after = undefined;
    expect(refusal!.fields).toEqual({ photo: NOT_RECEIVED });
    // The read asks for exactly the version the HEAD saw.
    // Source: AWS S3 docs, "Checking object integrity": the ETag of an object uploaded in one part
    // (PUT or POST, no SSE-KMS) is the MD5 digest of its bytes; RFC 9110 section 13.1.1 If-Match.
    const get = requests.find((r) => r.method === 'GET' && r.key === uploadKey)!;
    expect(get.headers['if-match']).toBe(`"${createHash('md5').update(first).digest('hex')}"`);
    expect((await row(ref.photoId)).status).toBe('pending');

    // Completing again checks what is there now, whole.
    const photo = await completeUpload(orm.em.fork(), ref);
    expect(photo).toMatchObject({ status: 'ready', width: 800, height: 600 });
  });

  test('a photo row whose upload key is not under its own firm and draft is never read', async () => {
    const { ref } = await newUpload(await smallPng());
    const elsewhere = `uploads/${randomUUID()}/${randomUUID()}/${randomUUID()}`;
    await orm.em.fork().nativeUpdate(LeadPhoto, { id: ref.photoId }, { uploadKey: elsewhere });
    const requests = await storageRequestsDuring(() => completeUpload(orm.em.fork(), ref));
    expect(requests).toEqual([]);
    await expect(completeUpload(orm.em.fork(), ref)).rejects.toThrow(/upload key/);
  });
});
