import { RETURN_PHOTO_MAX_BYTES, RETURN_PHOTOS_MAX } from '../../../../shared/schemas/warehouse';

/** The same image types the server takes; it checks the bytes again, this only saves a wasted upload. */
export const RETURN_PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;

export function formatBytes(bytes: number): string {
  if (bytes >= 1_000_000) return `${(bytes / 1_000_000).toFixed(1)} MB`;
  if (bytes >= 1000) return `${Math.round(bytes / 1000)} kB`;
  return `${bytes} bytes`;
}

/** Splits newly chosen files into those that may be added and a message for each refused one. */
export function checkPhotos(current: readonly File[], chosen: readonly File[]): { accepted: File[]; problems: string[] } {
  const accepted: File[] = [];
  const problems: string[] = [];
  for (const file of chosen) {
    if (!(RETURN_PHOTO_TYPES as readonly string[]).includes(file.type)) problems.push(`${file.name} is not a JPEG, PNG or WebP image.`);
    else if (file.size > RETURN_PHOTO_MAX_BYTES) problems.push(`${file.name} is ${formatBytes(file.size)}; each photo may be at most ${formatBytes(RETURN_PHOTO_MAX_BYTES)}.`);
    else if (current.length + accepted.length >= RETURN_PHOTOS_MAX) problems.push(`${file.name} was left out: at most ${RETURN_PHOTOS_MAX} photos.`);
    else accepted.push(file);
  }
  return { accepted, problems };
}
