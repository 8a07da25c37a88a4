import { useState } from 'react';
import type { Attachment } from '../../../../shared/schemas/case';
import { Dialog } from '../../../components/ui/Dialog';

/** Thumbnails; a click opens the lightbox, where ← and → step through and Esc closes. */
export function ScreenshotGallery({ shots }: { shots: Attachment[] }) {
  const [open, setOpen] = useState<number | null>(null);
  if (shots.length === 0) return null;
  const step = (by: number) => setOpen((i) => (i === null ? i : (i + by + shots.length) % shots.length));
  const shot = open === null ? null : shots[open];
  return (
    <>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label="Screenshots">
        {shots.map((s, i) => (
          <li key={s.id}>
            <button
              type="button"
              onClick={() => setOpen(i)}
              className="block w-full overflow-hidden rounded-md border border-rule bg-sheet hover:border-ink"
              aria-label={`Open screenshot ${i + 1} of ${shots.length}: ${s.originalName}`}
            >
              <img src={s.thumbnailUrl ?? s.url} alt="" className="aspect-[4/3] w-full object-contain" />
            </button>
          </li>
        ))}
      </ul>
      <Dialog
        open={shot !== null}
        onClose={() => setOpen(null)}
        title={shot ? `Screenshot ${open! + 1} of ${shots.length}: ${shot.originalName}` : 'Screenshot'}
        className="w-[min(72rem,calc(100vw-1rem))]!"
        onKeyDown={(e) => {
          if (e.key === 'ArrowRight') {
            e.preventDefault();
            step(1);
          } else if (e.key === 'ArrowLeft') {
            e.preventDefault();
            step(-1);
          }
        }}
      >
        {shot && (
          <figure className="flex flex-col gap-3">
            <img src={shot.url} alt={`Screenshot ${shot.originalName}`} className="max-h-[70vh] w-full rounded border border-rule bg-paper object-contain" />
            <figcaption className="flex flex-wrap items-center justify-between gap-2 text-sm">
              <span className="font-mono text-xs text-muted">
                {shot.width && shot.height ? `${shot.width} × ${shot.height} px` : ''}
              </span>
              <span className="flex gap-2">
                {shots.length > 1 && (
                  <>
                    <button type="button" onClick={() => step(-1)} className="rounded-md border border-rule px-3 py-1.5" aria-label="Previous screenshot">
                      ← Previous
                    </button>
                    <button type="button" onClick={() => step(1)} className="rounded-md border border-rule px-3 py-1.5" aria-label="Next screenshot">
                      Next →
                    </button>
                  </>
                )}
                <button type="button" onClick={() => setOpen(null)} className="rounded-md bg-ink px-3 py-1.5 font-semibold text-paper" autoFocus>
                  Close
                </button>
              </span>
            </figcaption>
          </figure>
        )}
      </Dialog>
    </>
  );
}
