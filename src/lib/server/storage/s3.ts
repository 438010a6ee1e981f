/**
 * The one door to object storage (S3, or the local s3rver stand-in). Everything else calls these
 * functions with keys and buffers and never sees the SDK.
 */
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { createPresignedPost } from '@aws-sdk/s3-presigned-post';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { config } from '../config';

let client: S3Client | undefined;

function s3(): S3Client {
  if (!client) {
    const settings = config.s3;
    client = new S3Client({
      endpoint: settings.endpoint,
      region: settings.region,
      forcePathStyle: settings.forcePathStyle,
      credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
      // With the SDK's default checksums, streamed bodies reach s3rver in aws-chunked framing and are
      // stored corrupted, and presigned URLs carry the checksum of an empty body (docs/sources.md §15).
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  }
  return client;
}

function bucket(): string {
  return config.s3.bucket;
}

function isMissing(error: unknown): boolean {
  return error instanceof S3ServiceException && (error.name === 'NotFound' || error.name === 'NoSuchKey' || error.$metadata.httpStatusCode === 404);
}

/** The object is no longer the version asked for (If-Match), or shrank below the range asked for. */
function isChanged(error: unknown): boolean {
  return (
    error instanceof S3ServiceException &&
    (error.name === 'PreconditionFailed' || error.name === 'InvalidRange' || error.$metadata.httpStatusCode === 412 || error.$metadata.httpStatusCode === 416)
  );
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
}

/**
 * The object in memory, or null when there is no such key. Callers check the size first.
 *
 * `ifMatch` (an ETag from headObject) reads exactly that version: S3 answers 412 when the object
 * has changed since, and since the local stand-in ignores If-Match the ETag of the answer is
 * compared here as well; either way the answer is null. `maxBytes` bounds the read to that many
 * bytes plus one, so a caller can tell "too big" without holding all of it.
 */
export async function getObjectBuffer(key: string, { ifMatch, maxBytes }: { ifMatch?: string; maxBytes?: number } = {}): Promise<Buffer | null> {
  try {
    const result = await s3().send(
      new GetObjectCommand({ Bucket: bucket(), Key: key, IfMatch: ifMatch, Range: maxBytes === undefined ? undefined : `bytes=0-${maxBytes}` }),
    );
    if (ifMatch !== undefined && result.ETag !== ifMatch) {
      await result.Body?.transformToByteArray().catch(() => undefined);
      return null;
    }
    if (!result.Body) return Buffer.alloc(0);
    return Buffer.from(await result.Body.transformToByteArray());
  } catch (error) {
    if (isMissing(error) || isChanged(error)) return null;
    throw error;
  }
}

/** Size and ETag of a stored object, or null when there is no such key. */
export async function headObject(key: string): Promise<{ size: number; etag: string } | null> {
  try {
    const result = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return { size: result.ContentLength ?? 0, etag: result.ETag ?? '' };
  } catch (error) {
    if (isMissing(error)) return null;
    throw error;
  }
}

/** Deleting a key that is not there is not an error (S3 answers 204 either way). */
export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

export type PresignedUpload = { url: string; fields: Record<string, string> };

/**
 * A browser form upload to exactly `key`. The policy bounds the size (`content-length-range`) and the
 * declared content type, so real S3 refuses anything larger than `maxBytes` before storing it.
 * Local s3rver enforces neither, so the caller must check the stored object afterwards anyway.
 */
export async function presignUpload({
  key,
  maxBytes,
  contentType,
  expiresSeconds,
}: {
  key: string;
  maxBytes: number;
  contentType: string;
  expiresSeconds: number;
}): Promise<PresignedUpload> {
  const { url, fields } = await createPresignedPost(s3(), {
    Bucket: bucket(),
    Key: key,
    Conditions: [
      ['content-length-range', 1, maxBytes],
      ['eq', '$key', key],
      ['starts-with', '$Content-Type', 'image/'],
    ],
    Fields: { 'Content-Type': contentType },
    Expires: expiresSeconds,
  });
  return { url, fields };
}

/**
 * A short-lived link to a stored image. The response is forced to `image/jpeg`, shown inline, so
 * the object can never be served as a page or a download of some other type.
 */
export async function signedImageUrl(key: string, expiresSeconds: number): Promise<string> {
  return getSignedUrl(
    s3(),
    new GetObjectCommand({
      Bucket: bucket(),
      Key: key,
      ResponseContentType: 'image/jpeg',
      ResponseContentDisposition: 'inline',
    }),
    { expiresIn: expiresSeconds },
  );
}
