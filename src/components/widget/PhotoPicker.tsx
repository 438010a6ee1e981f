import { useCallback, useEffect, useId, useRef, useState } from 'react';
import { useDropzone, type FileRejection } from 'react-dropzone';
import { ACCEPTED_PHOTO_TYPES, MAX_PHOTO_BYTES, MAX_PHOTOS, PHOTO_MESSAGES } from '~/lib/shared/photo-schemas';
import { completeUpload, OFFLINE_MESSAGE, removeUpload, requestUpload } from '~/components/widget/photos/photo-api';
import { shrinkPhoto } from '~/components/widget/photos/shrink-photo';
import { uploadWithProgress } from '~/components/widget/photos/upload-with-progress';

export type PickedPhoto = { id: string; thumbnailUrl: string; name: string };

type Props = {
  slug: string;
  formToken: string;
  /** Called with the checked photos whenever that list changes. */
  onChange: (photos: PickedPhoto[]) => void;
  /** True while any photo is still being prepared, sent, checked or removed (e.g. to hold the send button). */
  onBusyChange?: (busy: boolean) => void;
  /** Photos already checked (kept across a reload or a return to this step), listed as added. */
  initial?: PickedPhoto[];
};

type Step = 'waiting' | 'preparing' | 'uploading' | 'checking' | 'ready' | 'refused' | 'failed' | 'removing';

/** What the list shows for one file. */
type Item = {
  key: string;
  name: string;
  step: Step;
  progress: number;
  previewUrl: string | null;
  photoId: string | null;
  thumbnailUrl: string | null;
  message: string | null;
};

/** What the upload of one file needs to carry on, or to be undone. */
type Job = {
  file: File;
  blob: Blob | null;
  photoId: string | null;
  uploaded: boolean;
  abort: (() => void) | null;
  removed: boolean;
};

const BUSY_STEPS: Step[] = ['waiting', 'preparing', 'uploading', 'checking', 'removing'];
const UPLOAD_TURNED_AWAY = 'This photo could not be uploaded. It may be over 15 MB.';

function statusText(item: Item): string {
  switch (item.step) {
    case 'waiting':
      return 'Waiting its turn…';
    case 'preparing':
      return 'Getting it ready…';
    case 'uploading':
      return `Uploading… ${Math.round(item.progress * 100)}%`;
    case 'checking':
      return 'Checking the photo…';
    case 'ready':
      return 'Added.';
    case 'removing':
      return 'Removing…';
    default:
      return item.message ?? '';
  }
}

let nextKey = 0;

/**
 * The widget's photo step: pick or drop up to ten photos; each is shrunk in the browser, uploaded
 * straight to storage with its own progress bar, then checked by the server. Refused photos say
 * why, interrupted ones can be tried again, and any photo can be removed before the form is sent.
 */
/** List items and upload records for photos that are already on the server, so they can be removed like new ones. */
function seed(initial: PickedPhoto[]): { items: Item[]; jobs: Map<string, Job> } {
  const jobs = new Map<string, Job>();
  const items = initial.map((photo): Item => {
    const key = `photo-${nextKey++}`;
    jobs.set(key, { file: new File([], photo.name), blob: null, photoId: photo.id, uploaded: true, abort: null, removed: false });
    return { key, name: photo.name, step: 'ready', progress: 1, previewUrl: null, photoId: photo.id, thumbnailUrl: photo.thumbnailUrl, message: null };
  });
  return { items, jobs };
}

export default function PhotoPicker({ slug, formToken, onChange, onBusyChange, initial = [] }: Props) {
  const [seeded] = useState(() => seed(initial));
  const [items, setItems] = useState<Item[]>(seeded.items);
  const [notices, setNotices] = useState<string[]>([]);
  const [announcement, setAnnouncement] = useState('');
  const itemsRef = useRef(items);
  itemsRef.current = items;
  const jobs = useRef(seeded.jobs);
  const queue = useRef<Promise<void>>(Promise.resolve());
  const hintId = useId();

  const update = useCallback((key: string, patch: Partial<Item>) => {
    setItems((list) => list.map((item) => (item.key === key ? { ...item, ...patch } : item)));
  }, []);

  const refuse = useCallback(
    (key: string, name: string, message: string) => {
      update(key, { step: 'refused', message, progress: 0 });
      setAnnouncement(`${name}: ${message}`);
    },
    [update],
  );

  const fail = useCallback(
    (key: string, name: string, message: string) => {
      update(key, { step: 'failed', message });
      setAnnouncement(`${name} did not finish uploading. ${message}`);
    },
    [update],
  );

  /** Takes one file as far as it can go: shrink, upload, check. Safe to call again after a failure. */
  const process = useCallback(
    async (key: string) => {
      const job = jobs.current.get(key);
      if (!job || job.removed) return;
      const name = job.file.name;

      if (!job.blob) {
        update(key, { step: 'preparing', message: null });
        const shrunk = await shrinkPhoto(job.file);
        if (shrunk) {
          job.blob = shrunk;
          update(key, { previewUrl: URL.createObjectURL(shrunk) });
        } else if ((ACCEPTED_PHOTO_TYPES as readonly string[]).includes(job.file.type)) {
          job.blob = job.file; // this browser cannot read it; the server will decide
        } else {
          return refuse(key, name, PHOTO_MESSAGES.notAPhoto);
        }
        if (job.blob.size > MAX_PHOTO_BYTES) return refuse(key, name, PHOTO_MESSAGES.tooBig);
      }
      if (job.removed) return;

      if (!job.uploaded) {
        // A link from an earlier, interrupted attempt may have expired: give it back and ask anew.
        if (job.photoId) void removeUpload(slug, formToken, job.photoId);
        job.photoId = null;
        update(key, { step: 'uploading', progress: 0, message: null });
        const ticket = await requestUpload(slug, formToken, { name, size: job.blob.size, type: job.blob.type || job.file.type });
        if (!ticket.ok) return ticket.retry ? fail(key, name, ticket.message) : refuse(key, name, ticket.message);
        job.photoId = ticket.data.photo.id;
        if (job.removed) {
          void removeUpload(slug, formToken, job.photoId);
          return;
        }
        const running = uploadWithProgress(ticket.data.upload, job.blob, 'photo', (fraction) => update(key, { progress: fraction }));
        job.abort = running.abort;
        const outcome = await running.done;
        job.abort = null;
        if (outcome === 'aborted' || job.removed) return;
        if (outcome === 'network') return fail(key, name, OFFLINE_MESSAGE);
        if (outcome === 'refused') return refuse(key, name, UPLOAD_TURNED_AWAY);
        job.uploaded = true;
      }

      update(key, { step: 'checking', progress: 1 });
      const checked = await completeUpload(slug, formToken, job.photoId!);
      if (job.removed) return;
      if (!checked.ok) return checked.retry ? fail(key, name, checked.message) : refuse(key, name, checked.message);
      update(key, { step: 'ready', photoId: checked.data.photo.id, thumbnailUrl: checked.data.photo.thumbnailUrl, message: null });
      setAnnouncement(`${name} added.`);
    },
    [slug, formToken, update, refuse, fail],
  );

  /** One file at a time: decoding several 12-megapixel photos at once can run a phone out of memory. */
  const enqueue = useCallback(
    (key: string) => {
      queue.current = queue.current
        .then(() => process(key))
        .catch(() => {
          const job = jobs.current.get(key);
          if (job && !job.removed) fail(key, job.file.name, 'Something went wrong. Please try again.');
        });
    },
    [process, fail],
  );

  const onDrop = useCallback(
    (accepted: File[], rejected: FileRejection[]) => {
      const room = MAX_PHOTOS - itemsRef.current.filter((item) => item.step !== 'refused').length;
      const taken = accepted.slice(0, Math.max(0, room));
      const left = accepted.slice(taken.length);
      const messages = rejected.map(
        ({ file, errors }) => `${file.name}: ${errors.some((e) => e.code === 'file-too-large') ? PHOTO_MESSAGES.tooBig : PHOTO_MESSAGES.notAPhoto}`,
      );
      if (left.length) messages.push(`${PHOTO_MESSAGES.tooMany} We left out ${left.map((f) => f.name).join(', ')}.`);
      setNotices(messages);

      const added: Item[] = taken.map((file) => {
        const key = `photo-${nextKey++}`;
        jobs.current.set(key, { file, blob: null, photoId: null, uploaded: false, abort: null, removed: false });
        return { key, name: file.name, step: 'waiting', progress: 0, previewUrl: null, photoId: null, thumbnailUrl: null, message: null };
      });
      if (added.length) {
        setItems((list) => [...list, ...added]);
        setAnnouncement(`${added.length} ${added.length === 1 ? 'photo' : 'photos'} added to the list.`);
        for (const item of added) enqueue(item.key);
      } else if (messages.length) {
        setAnnouncement(messages.join(' '));
      }
    },
    [enqueue],
  );

  const retry = (key: string) => {
    update(key, { step: 'waiting', message: null });
    enqueue(key);
  };

  const remove = async (item: Item) => {
    const job = jobs.current.get(item.key);
    if (job) {
      job.removed = true;
      job.abort?.();
      if (job.photoId) {
        update(item.key, { step: 'removing', message: null });
        const answer = await removeUpload(slug, formToken, job.photoId);
        // 404: already gone. Anything else: the photo is still on the server, so keep it listed.
        if (!answer.ok && answer.status !== 404) {
          job.removed = false;
          const message = answer.retry ? "We couldn't remove this photo. Please try again." : answer.message;
          const step: Step = item.step === 'ready' || item.step === 'refused' ? item.step : 'failed';
          update(item.key, { step, message });
          setAnnouncement(`${item.name}: ${message}`);
          return;
        }
      }
    }
    jobs.current.delete(item.key);
    if (item.previewUrl) URL.revokeObjectURL(item.previewUrl);
    setItems((list) => list.filter((other) => other.key !== item.key));
    setAnnouncement(`${item.name} removed.`);
  };

  // Tell the form about the checked photos, only when that list really changes.
  const onChangeRef = useRef(onChange);
  onChangeRef.current = onChange;
  const ready = items.filter((item) => item.step === 'ready' && item.photoId && item.thumbnailUrl);
  const readySignature = ready.map((item) => item.photoId).join(',');
  useEffect(() => {
    onChangeRef.current(ready.map((item) => ({ id: item.photoId!, thumbnailUrl: item.thumbnailUrl!, name: item.name })));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [readySignature]);

  const busy = items.some((item) => BUSY_STEPS.includes(item.step));
  const onBusyChangeRef = useRef(onBusyChange);
  onBusyChangeRef.current = onBusyChange;
  useEffect(() => onBusyChangeRef.current?.(busy), [busy]);

  // Leaving the page: stop uploads and free the local previews.
  useEffect(() => {
    const running = jobs.current;
    return () => {
      for (const job of running.values()) job.abort?.();
      for (const item of itemsRef.current) if (item.previewUrl) URL.revokeObjectURL(item.previewUrl);
    };
  }, []);

  const counted = items.filter((item) => item.step !== 'refused').length;
  const full = counted >= MAX_PHOTOS;
  const { getRootProps, getInputProps, open, isDragActive } = useDropzone({
    onDrop,
    accept: { 'image/*': [] },
    maxSize: MAX_PHOTO_BYTES,
    multiple: true,
    // The button below is the keyboard and tap path; the whole area still takes dropped files.
    noClick: true,
    noKeyboard: true,
    disabled: full,
  });

  return (
    <div className="space-y-3">
      <div
        {...getRootProps({
          className: `rounded-lg border-2 border-dashed p-4 text-center transition-colors ${
            isDragActive ? 'border-[var(--brand)] bg-sawdust/40' : 'border-slate/40 bg-white'
          }`,
        })}
      >
        <input {...getInputProps({ 'aria-label': 'Photos of your walls', 'aria-describedby': hintId })} />
        <button
          type="button"
          onClick={open}
          disabled={full}
          aria-describedby={hintId}
          className="inline-flex min-h-11 items-center justify-center rounded-md bg-[var(--brand)] px-4 py-2 font-medium text-[var(--brand-text)] disabled:opacity-60"
        >
          {items.length ? 'Add more photos' : 'Add photos'}
        </button>
        <p id={hintId} className="mt-2 text-sm text-slate">
          {full
            ? `That's ${MAX_PHOTOS} photos, the most we can take. Remove one to add another.`
            : `JPEG, PNG or WebP, up to ${MAX_PHOTOS} photos of 15 MB each. You can also drop them here.`}
        </p>
      </div>

      {notices.length > 0 && (
        <ul className="space-y-1">
          {notices.map((notice) => (
            <li key={notice} className="field-error">
              {notice}
            </li>
          ))}
        </ul>
      )}

      {items.length > 0 && (
        <ul className="space-y-2" aria-label="Your photos">
          {items.map((item) => (
            <PhotoRow key={item.key} item={item} onRetry={() => retry(item.key)} onRemove={() => void remove(item)} />
          ))}
        </ul>
      )}

      <p className="sr-only" aria-live="polite" role="status">
        {announcement}
      </p>
    </div>
  );
}

function PhotoRow({ item, onRetry, onRemove }: { item: Item; onRetry: () => void; onRemove: () => void }) {
  const picture = item.step === 'ready' ? item.thumbnailUrl : item.previewUrl;
  const trouble = item.step === 'refused' || item.step === 'failed';
  return (
    <li className="flex gap-3 rounded-md border border-slate/20 bg-white p-2">
      <div className="h-16 w-16 flex-none overflow-hidden rounded bg-paper">
        {picture ? (
          <img src={picture} alt="" className={`h-full w-full object-cover ${item.step === 'ready' ? '' : 'opacity-60'}`} />
        ) : (
          <div className="h-full w-full" aria-hidden="true" />
        )}
      </div>
      <div className="min-w-0 flex-1">
        <p className="truncate text-sm font-medium text-ink" title={item.name}>
          {item.name}
        </p>
        <p className={`text-sm ${trouble ? 'text-brick' : 'text-slate'}`}>{statusText(item)}</p>
        {item.step === 'uploading' && (
          <div
            role="progressbar"
            aria-label={`Uploading ${item.name}`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={Math.round(item.progress * 100)}
            className="mt-1 h-1.5 w-full overflow-hidden rounded-full bg-slate/20"
          >
            <div className="h-full rounded-full bg-[var(--brand)] transition-[width]" style={{ width: `${Math.round(item.progress * 100)}%` }} />
          </div>
        )}
        <div className="mt-1 flex flex-wrap gap-2">
          {item.step === 'failed' && (
            <button type="button" className="button-quiet min-h-9 px-3 py-1 text-sm" onClick={onRetry} aria-label={`Try again ${item.name}`}>
              Try again
            </button>
          )}
          <button
            type="button"
            className="button-quiet min-h-9 px-3 py-1 text-sm"
            onClick={onRemove}
            disabled={item.step === 'removing'}
            aria-label={`Remove ${item.name}`}
          >
            Remove
          </button>
        </div>
      </div>
    </li>
  );
}
