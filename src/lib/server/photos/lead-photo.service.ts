/**
 * The homeowner's photos, from upload request to a checked, re-encoded image on a lead.
 *
 *   requestUpload   → a pending LeadPhoto and a presigned POST for the browser
 *   completeUpload  → the server checks and rewrites the uploaded file, or refuses it
 *   removePhoto     → the homeowner takes a photo back before sending
 *   attachDraftPhotos → the lead's transaction claims the draft's ready photos
 *   photoLinks      → short-lived links for staff
 *
 * Every query names the company; a photo of another firm or another draft is simply not found.
 */
import { randomUUID } from 'node:crypto';
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { displayName, MAX_PHOTO_BYTES, MAX_PHOTOS, PHOTO_MESSAGES } from '~/lib/shared/photo-schemas';
import { Conflict, InvalidInput, NotFound } from '../errors';
import { Lead } from '../leads/lead.entity';
import * as storage from '../storage/s3';
import { cleanPhoto, PhotoRefused, REFUSALS } from './photo-content';
import { LeadPhoto } from './lead-photo.entity';

/** How long the browser's presigned upload stays valid. */
export const UPLOAD_EXPIRES_SECONDS = 10 * 60;

/**
 * A pending photo holds its place in the draft's count this long; after that it is treated as
 * abandoned (the upload link has long expired), so a dropped connection cannot use up the slots.
 */
export const PENDING_HOLD_MS = 30 * 60 * 1000;

/** How long a staff link to a photo works. */
export const LINK_EXPIRES_SECONDS = 10 * 60;

export type DraftRef = { companyId: string; draftId: string };

export type UploadRequest = DraftRef & { name: string; size: number; type: string };

export type UploadTicket = { photo: LeadPhoto; upload: storage.PresignedUpload };

const uploadKey = (companyId: string, draftId: string) => `uploads/${companyId}/${draftId}/${randomUUID()}`;
const imageKey = (companyId: string, photoId: string) => `photos/${companyId}/${photoId}.jpg`;
const thumbKey = (companyId: string, photoId: string) => `thumbs/${companyId}/${photoId}.jpg`;

/** Ready photos uploaded under a widget draft: what the range is narrowed by, whatever the page claims. */
export function readyPhotoCount(em: EntityManager, { companyId, draftId }: DraftRef): Promise<number> {
  return em.count(LeadPhoto, { company: companyId, draftId, status: 'ready' });
}

/** Photos that count against the draft's limit: ready ones, and pending ones still within their hold. */
function countedPhotos(em: EntityManager, { companyId, draftId }: DraftRef, now: number): Promise<number> {
  return em.count(LeadPhoto, {
    company: companyId,
    draftId,
    $or: [{ status: 'ready' }, { status: 'pending', createdAt: { $gt: new Date(now - PENDING_HOLD_MS) } }],
  });
}

/**
 * Creates a pending photo under the draft and the presigned POST the browser uploads it with.
 * Refuses an eleventh photo, a declared size over 15 MB, and a declared type that is not an image
 * (the declared values are only a first filter; completeUpload checks the real bytes).
 */
export async function requestUpload(em: EntityManager, request: UploadRequest, now = Date.now()): Promise<UploadTicket> {
  if (!Number.isInteger(request.size) || request.size < 1) throw new InvalidInput(REFUSALS.empty, { size: REFUSALS.empty });
  if (request.size > MAX_PHOTO_BYTES) throw new InvalidInput(PHOTO_MESSAGES.tooBig, { size: PHOTO_MESSAGES.tooBig });
  if (!/^image\/[a-z0-9.+-]+$/i.test(request.type)) throw new InvalidInput(PHOTO_MESSAGES.notAPhoto, { type: PHOTO_MESSAGES.notAPhoto });

  const photo = await em.transactional(async (tx) => {
    // One draft at a time, across every app process, so two quick requests cannot both be the tenth.
    await tx.execute('select pg_advisory_xact_lock(hashtextextended(?, 0))', [`lead-photo-draft:${request.draftId}`]);
    if ((await countedPhotos(tx, request, now)) >= MAX_PHOTOS) {
      throw new InvalidInput(PHOTO_MESSAGES.tooMany, { photo: PHOTO_MESSAGES.tooMany });
    }
    return tx.create(LeadPhoto, {
      company: request.companyId,
      draftId: request.draftId,
      uploadKey: uploadKey(request.companyId, request.draftId),
      originalName: displayName(request.name),
      createdAt: new Date(now),
    });
  });

  const upload = await storage.presignUpload({
    key: photo.uploadKey,
    maxBytes: MAX_PHOTO_BYTES,
    contentType: request.type.toLowerCase(),
    expiresSeconds: UPLOAD_EXPIRES_SECONDS,
  });
  return { photo, upload };
}

function findDraftPhoto(em: EntityManager, { companyId, draftId }: DraftRef, photoId: string, lock = false): Promise<LeadPhoto | null> {
  return em.findOne(LeadPhoto, { id: photoId, company: companyId, draftId }, lock ? { lockMode: LockMode.PESSIMISTIC_WRITE } : {});
}

/**
 * How long one request may take to check a photo (seconds in practice). A request that died in
 * the middle leaves the photo `checking`; after this long another request takes the check over.
 */
export const CHECK_CLAIM_MS = 2 * 60 * 1000;

/** How often a request that finds the photo being checked by another looks again. */
const CHECK_WAIT_STEP_MS = 150;

const NOT_RECEIVED = 'We did not receive this photo. Please try again.';

/** The shape of the upload key `requestUpload` signs: the photo's own firm and draft, then a UUID. */
const SIGNED_UPLOAD_KEY = /^uploads\/([0-9a-f-]{36})\/([0-9a-f-]{36})\/[0-9a-f-]{36}$/;

type PhotoRef = DraftRef & { photoId: string };

/** What the claiming transaction found. */
type ClaimStep =
  | { kind: 'ready'; photo: LeadPhoto }
  | { kind: 'refused'; refusal: string; deleteUpload?: string }
  | { kind: 'busy' }
  | { kind: 'claimed'; uploadKey: string; checkingUntil: Date };

/** What the storage reads and the image work found. */
type Verdict =
  | { kind: 'missing' }
  | { kind: 'refused'; refusal: string }
  | { kind: 'clean'; imageKey: string; thumbKey: string; width: number; height: number; bytes: number };

/**
 * Checks the file the browser uploaded and keeps a clean copy, or refuses it.
 *
 * Only the stored object at the key we signed is trusted: its size from HeadObject (the storage's
 * size policy is not enforced by the local stand-in), its type from its first bytes, its pixels by
 * decoding; the bytes read are the very version whose size was checked (If-Match on its ETag).
 * Success: `ready`, with the re-encoded image and thumbnail stored and the upload deleted.
 * Refusal: the upload is deleted, the photo is `refused`, and InvalidInput (field `photo`) carries
 * the message. Nothing (or a changed object) arrived: the photo stays `pending` for another try.
 *
 * No transaction or pool connection is held through storage or sharp: a short transaction claims
 * the photo (`checking` until a deadline), the work runs outside, and a second short transaction
 * records the result while the claim is still ours. A repeated or parallel call waits for the
 * check under way and answers its result, so every call ends with the same one.
 */
export async function completeUpload(em: EntityManager, ref: PhotoRef, now = Date.now()): Promise<LeadPhoto> {
  const started = Date.now();
  // `now` is the time of the request; the clock moves on while we wait for another check.
  const clock = () => now + (Date.now() - started);
  for (;;) {
    const step = await claimCheck(em.fork(), ref, clock());
    if (step.kind === 'ready') return step.photo;
    if (step.kind === 'refused') {
      if (step.deleteUpload) await storage.deleteObject(step.deleteUpload);
      throw new InvalidInput(step.refusal, { photo: step.refusal });
    }
    if (step.kind === 'busy') {
      await new Promise((resolve) => setTimeout(resolve, CHECK_WAIT_STEP_MS));
      continue;
    }

    let verdict: Verdict;
    try {
      verdict = await inspectUpload(ref, step.uploadKey);
    } catch (error) {
      // Storage trouble: let go of the claim so the homeowner can try again at once.
      await em
        .fork()
        .nativeUpdate(LeadPhoto, { id: ref.photoId, status: 'checking', checkingUntil: step.checkingUntil }, { status: 'pending', checkingUntil: null });
      throw error;
    }
    const recorded = await recordCheck(em.fork(), ref, step, verdict);
    // Another request took over (ours outlived its deadline) and may have finished: answer its result.
    if (recorded === 'lost-claim') continue;
    if (recorded === 'removed') throw new NotFound('This photo is not part of this form.');
    if (verdict.kind === 'missing') throw new InvalidInput(NOT_RECEIVED, { photo: NOT_RECEIVED });
    // Refused or kept, the upload itself is not needed any more.
    await storage.deleteObject(step.uploadKey);
    if (verdict.kind === 'refused') throw new InvalidInput(verdict.refusal, { photo: verdict.refusal });
    return recorded;
  }
}

/** The short first transaction: answers a finished check, or claims the photo for this request. */
function claimCheck(em: EntityManager, ref: PhotoRef, now: number): Promise<ClaimStep> {
  return em.transactional(async (tx): Promise<ClaimStep> => {
    const photo = await findDraftPhoto(tx, ref, ref.photoId, true);
    if (!photo) throw new NotFound('This photo is not part of this form.');
    if (photo.status === 'ready') return { kind: 'ready', photo };
    if (photo.status === 'refused') return { kind: 'refused', refusal: photo.refusal ?? REFUSALS.notAPhoto };
    if (photo.status === 'checking' && photo.checkingUntil && photo.checkingUntil.getTime() > now) return { kind: 'busy' };
    if (now - photo.createdAt.getTime() > PENDING_HOLD_MS) {
      const refusal = 'This upload took too long to finish. Please add the photo again.';
      Object.assign(photo, { status: 'refused', refusal, checkingUntil: null });
      return { kind: 'refused', refusal, deleteUpload: photo.uploadKey };
    }
    // Defence in depth: whatever the row says, read nothing outside this photo's firm and draft.
    if (!isSignedUploadKey(photo.uploadKey, ref)) {
      throw new Error(`Photo ${photo.id} has an upload key outside its firm and draft; it is not read.`);
    }
    photo.status = 'checking';
    photo.checkingUntil = new Date(now + CHECK_CLAIM_MS);
    return { kind: 'claimed', uploadKey: photo.uploadKey, checkingUntil: photo.checkingUntil };
  });
}

function isSignedUploadKey(key: string, { companyId, draftId }: DraftRef): boolean {
  const match = SIGNED_UPLOAD_KEY.exec(key);
  return match !== null && match[1] === companyId && match[2] === draftId;
}

/** Storage reads, the image work and the writes of the clean copies, outside any transaction. */
async function inspectUpload(ref: PhotoRef, uploadKey: string): Promise<Verdict> {
  const stored = await storage.headObject(uploadKey);
  if (!stored) return { kind: 'missing' };
  if (stored.size > MAX_PHOTO_BYTES) return { kind: 'refused', refusal: REFUSALS.tooBig };
  if (stored.size === 0) return { kind: 'refused', refusal: REFUSALS.empty };

  // Exactly the version whose size was just checked, and never more than one byte past the limit.
  const bytes = await storage.getObjectBuffer(uploadKey, { ifMatch: stored.etag, maxBytes: MAX_PHOTO_BYTES });
  if (!bytes) return { kind: 'missing' };
  if (bytes.length > MAX_PHOTO_BYTES) return { kind: 'refused', refusal: REFUSALS.tooBig };

  let clean;
  try {
    clean = await cleanPhoto(bytes);
  } catch (error) {
    if (error instanceof PhotoRefused) return { kind: 'refused', refusal: error.message };
    throw error;
  }
  const image = imageKey(ref.companyId, ref.photoId);
  const thumb = thumbKey(ref.companyId, ref.photoId);
  await storage.putObject(image, clean.image, 'image/jpeg');
  await storage.putObject(thumb, clean.thumbnail, 'image/jpeg');
  return { kind: 'clean', imageKey: image, thumbKey: thumb, width: clean.width, height: clean.height, bytes: clean.image.length };
}

/**
 * The short second transaction: writes the verdict while the claim is still this request's.
 * 'lost-claim' when another request took over; 'removed' when the homeowner removed the photo
 * meanwhile (the copies just written are deleted again).
 */
async function recordCheck(em: EntityManager, ref: PhotoRef, claim: { checkingUntil: Date }, verdict: Verdict): Promise<LeadPhoto | 'lost-claim' | 'removed'> {
  const result = await em.transactional(async (tx): Promise<LeadPhoto | 'lost-claim' | 'removed'> => {
    const photo = await findDraftPhoto(tx, ref, ref.photoId, true);
    if (!photo) return 'removed';
    if (photo.status !== 'checking' || photo.checkingUntil?.getTime() !== claim.checkingUntil.getTime()) return 'lost-claim';
    photo.checkingUntil = null;
    if (verdict.kind === 'missing') {
      photo.status = 'pending';
    } else if (verdict.kind === 'refused') {
      Object.assign(photo, { status: 'refused', refusal: verdict.refusal });
    } else {
      Object.assign(photo, {
        status: 'ready',
        imageKey: verdict.imageKey,
        thumbKey: verdict.thumbKey,
        width: verdict.width,
        height: verdict.height,
        bytes: verdict.bytes,
      });
      // The homeowner may have sent the form while this photo was still on its way.
      const sentLead = await tx.findOne(Lead, { company: ref.companyId, draftId: ref.draftId });
      if (sentLead) photo.lead = sentLead;
    }
    return photo;
  });
  if (result === 'removed' && verdict.kind === 'clean') {
    for (const key of [verdict.imageKey, verdict.thumbKey]) await storage.deleteObject(key);
  }
  return result;
}

/**
 * The homeowner takes a photo back before sending: its row is deleted, then its stored files.
 * A photo already sent with a lead stays (Conflict); staff own it from then on.
 */
export async function removePhoto(em: EntityManager, ref: PhotoRef): Promise<void> {
  const keys = await em.transactional(async (tx) => {
    const photo = await findDraftPhoto(tx, ref, ref.photoId, true);
    if (!photo) throw new NotFound('This photo is not part of this form.');
    if (photo.lead) throw new Conflict('This photo was sent with your inquiry, so it can no longer be removed here.');
    tx.remove(photo);
    return [photo.uploadKey, photo.imageKey, photo.thumbKey];
  });
  // Outside the transaction. A check still under way finds the row gone and deletes its own copies.
  for (const key of keys) if (key) await storage.deleteObject(key);
}

/**
 * Hands the draft's ready photos to a new lead. Call it inside the transaction that creates the
 * lead, with that transaction's EntityManager; the caller's flush writes the lead first and then
 * the photos (the unit of work orders the inserts by the foreign key). Returns the attached photos.
 * Photos still being checked when the lead is sent are attached by completeUpload when they finish.
 */
export async function attachDraftPhotos(em: EntityManager, { companyId, draftId, lead }: DraftRef & { lead: Lead }): Promise<LeadPhoto[]> {
  const photos = await em.find(LeadPhoto, { company: companyId, draftId, status: 'ready', lead: null }, { orderBy: { createdAt: 'asc' } });
  for (const photo of photos) photo.lead = lead;
  return photos;
}

/** A lead's checked photos, oldest first, for the inquiry page. */
export function photosOfLead(em: EntityManager, { companyId, leadId }: { companyId: string; leadId: string }): Promise<LeadPhoto[]> {
  return em.find(LeadPhoto, { company: companyId, lead: leadId, status: 'ready' }, { orderBy: { createdAt: 'asc' } });
}

export type PhotoLinks = { imageUrl: string; thumbnailUrl: string; expiresAt: Date };

/**
 * Short-lived links to a ready photo and its thumbnail, served as `image/jpeg` inline whatever
 * was uploaded. Null for a photo that is not ready. The caller has already checked that the
 * viewer may see the photo (same firm).
 */
export async function photoLinks(photo: LeadPhoto, now = Date.now()): Promise<PhotoLinks | null> {
  if (photo.status !== 'ready' || !photo.imageKey || !photo.thumbKey) return null;
  const [imageUrl, thumbnailUrl] = await Promise.all([
    storage.signedImageUrl(photo.imageKey, LINK_EXPIRES_SECONDS),
    storage.signedImageUrl(photo.thumbKey, LINK_EXPIRES_SECONDS),
  ]);
  return { imageUrl, thumbnailUrl, expiresAt: new Date(now + LINK_EXPIRES_SECONDS * 1000) };
}
