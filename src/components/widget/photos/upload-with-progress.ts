/**
 * Sends a file to a presigned POST with XMLHttpRequest, because fetch reports no upload progress.
 * The signed fields go first and the file last, as S3 requires.
 */
export type UploadTarget = { url: string; fields: Record<string, string> };

export type UploadOutcome = 'done' | 'network' | 'refused' | 'aborted';

export type RunningUpload = { done: Promise<UploadOutcome>; abort: () => void };

export function uploadWithProgress(target: UploadTarget, file: Blob, fileName: string, onProgress: (fraction: number) => void): RunningUpload {
  const xhr = new XMLHttpRequest();
  const done = new Promise<UploadOutcome>((resolve) => {
    const form = new FormData();
    for (const [name, value] of Object.entries(target.fields)) form.append(name, value);
    form.append('file', file, fileName);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => resolve(xhr.status >= 200 && xhr.status < 300 ? 'done' : xhr.status === 403 ? 'network' : 'refused');
    xhr.onerror = () => resolve('network');
    xhr.ontimeout = () => resolve('network');
    xhr.onabort = () => resolve('aborted');
    xhr.open('POST', target.url);
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}
