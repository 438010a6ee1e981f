/**
 * Uploads to a presigned POST the way a browser form does: multipart/form-data, the signed fields
 * first, the file last (S3 ignores fields after the file).
 */
export async function uploadLikeABrowser(
  upload: { url: string; fields: Record<string, string> },
  bytes: Uint8Array,
  { name = 'photo.jpg', type = 'image/jpeg' }: { name?: string; type?: string } = {},
): Promise<Response> {
  const form = new FormData();
  for (const [key, value] of Object.entries(upload.fields)) form.append(key, value);
  // A copy, so the Blob owns a plain ArrayBuffer (a Node Buffer may sit on a shared pool).
  form.append('file', new Blob([Uint8Array.from(bytes)], { type }), name);
  return fetch(upload.url, { method: 'POST', body: form });
}
