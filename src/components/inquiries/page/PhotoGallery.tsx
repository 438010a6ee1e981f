/**
 * The homeowner's photos: thumbnails, and a full-size viewer (a modal dialog: ← and → move between
 * photos, Escape closes, focus goes back to the thumbnail). Photo links are signed for minutes only,
 * so the gallery asks the server for fresh ones a minute before they expire, when the tab comes
 * back into view, and whenever an image fails to load: an open page never shows a dead link.
 */
import { useEffect, useId, useRef, useState } from 'react';
import useSWR from 'swr';
import { refreshDelayMs, type GalleryAnswer } from '~/lib/shared/gallery';
import { getJson } from './api';

export function PhotoGallery({ leadId, initial }: { leadId: string; initial: GalleryAnswer }) {
  const id = useId();
  const { data, mutate } = useSWR<GalleryAnswer>(`/api/app/leads/${leadId}/photos`, getJson, {
    fallbackData: initial,
    revalidateOnMount: false,
    revalidateOnFocus: true,
    refreshInterval: (latest) => refreshDelayMs((latest ?? initial).expiresAt, Date.now()),
  });
  const photos = (data ?? initial).photos;
  const [open, setOpen] = useState<number | null>(null);
  const dialog = useRef<HTMLDialogElement>(null);
  const thumbs = useRef<(HTMLButtonElement | null)[]>([]);
  const lastOpened = useRef(0);
  // One fresh fetch per failing link; a link that fails again after that is shown as missing.
  const retried = useRef(new Set<string>());
  // Bumped after fresh links arrive, so each image is loaded again even if its link came back the same.
  const [generation, setGeneration] = useState(0);

  const onImageError = (url: string) => {
    if (retried.current.has(url)) return;
    retried.current.add(url);
    void mutate().then(() => setGeneration((g) => g + 1));
  };

  useEffect(() => {
    const el = dialog.current;
    if (!el) return;
    if (open !== null && !el.open) el.showModal();
    if (open === null && el.open) el.close();
  }, [open]);

  function show(index: number) {
    lastOpened.current = index;
    setOpen(index);
  }

  function move(step: number) {
    if (open === null || photos.length === 0) return;
    const next = (open + step + photos.length) % photos.length;
    lastOpened.current = next;
    setOpen(next);
  }

  if (photos.length === 0) return <p className="text-sm text-slate">No photos came with this inquiry.</p>;
  const current = open === null ? null : photos[Math.min(open, photos.length - 1)];

  return (
    <div>
      <ul className="mt-2 flex flex-wrap gap-3" aria-label="Photos from the homeowner">
        {photos.map((photo, index) => (
          <li key={photo.id}>
            <button
              type="button"
              ref={(el) => {
                thumbs.current[index] = el;
              }}
              onClick={() => show(index)}
              className="block rounded border border-slate/20 p-0"
              aria-label={`Open photo ${index + 1} of ${photos.length} full size: ${photo.name}`}
            >
              <img
                key={`${photo.id}-${generation}`}
                src={photo.thumbnailUrl}
                alt={`Photo ${photo.name}`}
                className="h-32 rounded"
                loading="lazy"
                onError={() => onImageError(photo.thumbnailUrl)}
              />
            </button>
          </li>
        ))}
      </ul>
      <dialog
        ref={dialog}
        aria-labelledby={`${id}-title`}
        className="max-h-[95vh] w-[min(95vw,72rem)] rounded-lg bg-white p-0 shadow-xl backdrop:bg-ink/70"
        onClose={() => {
          setOpen(null);
          thumbs.current[lastOpened.current]?.focus();
        }}
        onKeyDown={(e) => {
          if (e.key === 'ArrowRight') {
            e.preventDefault();
            move(1);
          } else if (e.key === 'ArrowLeft') {
            e.preventDefault();
            move(-1);
          }
        }}
      >
        {current && (
          <div className="flex flex-col">
            <div className="flex items-center justify-between gap-3 border-b border-slate/20 px-4 py-2">
              <h3 id={`${id}-title`} className="font-bold">
                Photo {open! + 1} of {photos.length}: <span className="font-normal">{current.name}</span>
              </h3>
              <button type="button" className="button-quiet px-3 py-1 text-sm" onClick={() => setOpen(null)} autoFocus>
                Close
              </button>
            </div>
            <div className="flex items-center justify-center bg-ink/5 p-2">
              <img
                key={`${current.id}-${generation}`}
                src={current.imageUrl}
                alt={`Photo ${current.name}, full size`}
                className="max-h-[75vh] max-w-full object-contain"
                width={current.width ?? undefined}
                height={current.height ?? undefined}
                onError={() => onImageError(current.imageUrl)}
              />
            </div>
            {photos.length > 1 && (
              <div className="flex items-center justify-between px-4 py-2 text-sm">
                <button type="button" className="button-quiet px-3 py-1" onClick={() => move(-1)}>
                  ← Previous
                </button>
                <span className="text-slate">Arrow keys move between photos; Escape closes.</span>
                <button type="button" className="button-quiet px-3 py-1" onClick={() => move(1)}>
                  Next →
                </button>
              </div>
            )}
          </div>
        )}
      </dialog>
    </div>
  );
}
