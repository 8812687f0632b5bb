import { useState } from 'react';
import { illustrationKind, type IllustrationInput } from '../../../shared/part-illustration';
import { PartDrawing } from './part-drawing';

export const partPhotoUrl = (name: string) => `/api/parts/photos/${encodeURIComponent(name)}`;

/**
 * A part's uploaded photo, or our line drawing of its kind when it has none (or the photo will not load).
 * Decorative: it sits beside the part's title, so it is hidden from assistive technology and adds no text.
 */
export function PartPicture({ part, photo, className = 'size-16' }: { part: IllustrationInput; photo: string | null; className?: string }) {
  const [failed, setFailed] = useState<string | null>(null);
  const showPhoto = photo !== null && failed !== photo;
  return (
    <div aria-hidden="true" className={`shrink-0 overflow-hidden rounded-md bg-white ring-1 ring-cast-line ${className}`}>
      {showPhoto ? (
        <img src={partPhotoUrl(photo)} alt="" loading="lazy" decoding="async" onError={() => setFailed(photo)} className="size-full object-contain" />
      ) : (
        <PartDrawing kind={illustrationKind(part)} className="size-full p-[6%]" />
      )}
    </div>
  );
}
