/**
 * Photos nobody will ever send are removed after the retention period, stored files included;
 * photos of sent inquiries stay. Rows are back-dated instead of waiting. The database is this
 * file's own, since the clean-up sweeps every firm.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Company } from '../../src/lib/server/companies/company.entity';
import { LeadPhoto, type PhotoStatus } from '../../src/lib/server/photos/lead-photo.entity';
import { abandonedPhotosJob, ABANDONED_PHOTO_RETENTION_MS, removeAbandonedPhotos } from '../../src/lib/server/photos/abandoned-photos';
import { headObject, putObject } from '../../src/lib/server/storage/s3';
import { buildLead } from '../helpers/factories';
import { openMigratedDatabase } from '../helpers/migrated-database';

const HOUR = 60 * 60 * 1000;

let orm: MikroORM;
let closeDatabase: () => Promise<void>;
let firm: Company;

beforeAll(async () => {
  ({ orm, close: closeDatabase } = await openMigratedDatabase());
  const em = orm.em.fork();
  firm = em.create(Company, { slug: 'clean-up-firm', name: 'Clean-up Test Joinery' });
  await em.flush();
});
afterAll(async () => {
  await closeDatabase?.();
});

type Stored = { id: string; keys: string[] };

/** A photo row of `ageHours`, with the stored objects its status implies (all really written). */
async function photo({
  ageHours,
  status,
  sent = false,
  uploadLeftOver = false,
}: {
  ageHours: number;
  status: PhotoStatus;
  sent?: boolean;
  uploadLeftOver?: boolean;
}): Promise<Stored> {
  const em = orm.em.fork();
  const id = randomUUID();
  const draftId = randomUUID();
  const createdAt = new Date(Date.now() - ageHours * HOUR);
  const uploadKey = `uploads/${firm.id}/${draftId}/${randomUUID()}`;
  const ready = status === 'ready';
  const keys = [
    ...(status === 'pending' || status === 'checking' || uploadLeftOver ? [uploadKey] : []),
    ...(ready ? [`photos/${firm.id}/${id}.jpg`, `thumbs/${firm.id}/${id}.jpg`] : []),
  ];
  for (const key of keys) await putObject(key, Buffer.from('stored bytes'), 'image/jpeg');
  const lead = sent ? buildLead(em, firm.id, { draftId, createdAt }) : null;
  em.create(LeadPhoto, {
    id,
    company: firm,
    draftId,
    lead,
    status,
    uploadKey,
    imageKey: ready ? keys.at(-2)! : null,
    thumbKey: ready ? keys.at(-1)! : null,
    originalName: 'wall.jpg',
    refusal: status === 'refused' ? 'This file is empty.' : null,
    createdAt,
  });
  await em.flush();
  return { id, keys };
}

const exists = async (id: string) => (await orm.em.fork().count(LeadPhoto, { id })) === 1;
const storedKeys = async (keys: string[]) => (await Promise.all(keys.map(async (key) => ((await headObject(key)) ? key : null)))).filter(Boolean);

describe('removing abandoned photos', () => {
  test('the retention is 48 hours', () => {
    expect(ABANDONED_PHOTO_RETENTION_MS).toBe(48 * HOUR);
  });

  test('unsent drafts’ photos and refused or unfinished uploads older than 48 hours go, files included; sent inquiries’ photos stay', async () => {
    const gone = {
      unsentReady: await photo({ ageHours: 49, status: 'ready' }),
      refusedWithLeftOverUpload: await photo({ ageHours: 49, status: 'refused', uploadLeftOver: true }),
      refused: await photo({ ageHours: 72, status: 'refused' }),
      uploadedNeverCompleted: await photo({ ageHours: 49, status: 'pending' }),
      checkDiedMidway: await photo({ ageHours: 50, status: 'checking' }),
    };
    const kept = {
      unsentButRecent: await photo({ ageHours: 47, status: 'ready' }),
      pendingRecent: await photo({ ageHours: 1, status: 'pending' }),
      sentLongAgo: await photo({ ageHours: 30 * 24, status: 'ready', sent: true }),
    };
    // Every photo above really has its files in storage to begin with.
    for (const p of [...Object.values(gone), ...Object.values(kept)]) expect(await storedKeys(p.keys)).toEqual(p.keys);

    const { removed } = await removeAbandonedPhotos(orm.em.fork());
    expect(removed).toBe(Object.keys(gone).length);

    for (const [name, p] of Object.entries(gone)) {
      expect({ name, row: await exists(p.id), files: await storedKeys(p.keys) }).toEqual({ name, row: false, files: [] });
    }
    for (const [name, p] of Object.entries(kept)) {
      expect({ name, row: await exists(p.id), files: await storedKeys(p.keys) }).toEqual({ name, row: true, files: p.keys });
    }

    // A second run finds nothing more to do.
    expect((await removeAbandonedPhotos(orm.em.fork())).removed).toBe(0);
  });

  test('the scheduled job does the same', async () => {
    const old = await photo({ ageHours: 60, status: 'ready' });
    expect(abandonedPhotosJob.schedule).toBeTruthy();
    await abandonedPhotosJob.run({}, { em: orm.em.fork(), send: async () => null });
    expect(await exists(old.id)).toBe(false);
    expect(await storedKeys(old.keys)).toEqual([]);
  });
});
