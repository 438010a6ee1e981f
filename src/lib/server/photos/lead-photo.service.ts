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
  return em.findOne(
    LeadPhoto,
    { id: photoId, company: companyId, draftId },
    lock ? { lockMode: LockMode.PESSIMISTIC_WRITE } : {},
  );
}

type CheckOutcome = { photo: LeadPhoto } | { refusal: string };

/**
 * Checks the file the browser uploaded and keeps a clean copy, or refuses it.
 *
 * The stored object is the only thing trusted: its size from HeadObject (the storage's size policy
 * is not enforced by the local stand-in), its type from its first bytes, its pixels by decoding.
 * Success: `ready`, with the re-encoded image and thumbnail stored and the upload deleted.
 * Refusal: the upload is deleted, the photo is `refused`, and InvalidInput (field `photo`) carries
 * the message. Calling it again for a ready photo answers the same photo.
 */
export async function completeUpload(em: EntityManager, ref: DraftRef & { photoId: string }, now = Date.now()): Promise<LeadPhoto> {
  const outcome = await em.transactional(async (tx): Promise<CheckOutcome> => {
    // The row lock makes a repeated or parallel "complete" wait for the first and then see its result.
    const photo = await findDraftPhoto(tx, ref, ref.photoId, true);
    if (!photo) throw new NotFound('This photo is not part of this form.');
    if (photo.status === 'ready') return { photo };
    if (photo.status === 'refused') return { refusal: photo.refusal ?? REFUSALS.notAPhoto };

    const refuse = async (message: string): Promise<CheckOutcome> => {
      await storage.deleteObject(photo.uploadKey);
      photo.status = 'refused';
      photo.refusal = message;
      return { refusal: message };
    };

    if (now - photo.createdAt.getTime() > PENDING_HOLD_MS) {
      return refuse('This upload took too long to finish. Please add the photo again.');
    }
    const stored = await storage.headObject(photo.uploadKey);
    if (!stored) {
      // Nothing arrived (yet): leave it pending so the browser can upload again and retry.
      throw new InvalidInput('We did not receive this photo. Please try again.', { photo: 'We did not receive this photo. Please try again.' });
    }
    if (stored.size > MAX_PHOTO_BYTES) return refuse(REFUSALS.tooBig);
    if (stored.size === 0) return refuse(REFUSALS.empty);

    const bytes = await storage.getObjectBuffer(photo.uploadKey);
    if (!bytes) throw new InvalidInput('We did not receive this photo. Please try again.', { photo: 'We did not receive this photo. Please try again.' });
    if (bytes.length > MAX_PHOTO_BYTES) return refuse(REFUSALS.tooBig);

    let clean;
    try {
      clean = await cleanPhoto(bytes);
    } catch (error) {
      if (error instanceof PhotoRefused) return refuse(error.message);
      throw error;
    }

    const image = imageKey(ref.companyId, photo.id);
    const thumb = thumbKey(ref.companyId, photo.id);
    await storage.putObject(image, clean.image, 'image/jpeg');
    await storage.putObject(thumb, clean.thumbnail, 'image/jpeg');
    await storage.deleteObject(photo.uploadKey);
    Object.assign(photo, { status: 'ready', imageKey: image, thumbKey: thumb, width: clean.width, height: clean.height, bytes: clean.image.length });

    // The homeowner may have sent the form while this photo was still on its way.
    const sentLead = await tx.findOne(Lead, { company: ref.companyId, draftId: ref.draftId });
    if (sentLead) photo.lead = sentLead;
    return { photo };
  });

  if ('refusal' in outcome) throw new InvalidInput(outcome.refusal, { photo: outcome.refusal });
  return outcome.photo;
}

/**
 * The homeowner takes a photo back before sending: its stored files and its row are deleted.
 * A photo already sent with a lead stays (Conflict); staff own it from then on.
 */
export async function removePhoto(em: EntityManager, ref: DraftRef & { photoId: string }): Promise<void> {
  await em.transactional(async (tx) => {
    const photo = await findDraftPhoto(tx, ref, ref.photoId, true);
    if (!photo) throw new NotFound('This photo is not part of this form.');
    if (photo.lead) throw new Conflict('This photo was sent with your inquiry, so it can no longer be removed here.');
    for (const key of [photo.uploadKey, photo.imageKey, photo.thumbKey]) {
      if (key) await storage.deleteObject(key);
    }
    tx.remove(photo);
  });
}

/**
 * Hands the draft's ready photos to a new lead. Call it inside the transaction that creates the
 * lead, with that transaction's EntityManager; the caller's flush writes the lead first and then
 * the photos (the unit of work orders the inserts by the foreign key). Returns the attached photos.
 * Photos still being checked when the lead is sent are attached by completeUpload when they finish.
 */
export async function attachDraftPhotos(
  em: EntityManager,
  { companyId, draftId, lead }: DraftRef & { lead: Lead },
): Promise<LeadPhoto[]> {
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
