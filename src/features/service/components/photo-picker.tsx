import { ImagePlus, X } from 'lucide-react';
import { useState } from 'react';
import { SERVICE_PHOTO_MAX_BYTES } from '../../../../shared/schemas/service';
import { Button } from '../../../components/ui/button';

const TYPES = ['image/jpeg', 'image/png', 'image/webp'];
const mb = (bytes: number) => `${(bytes / 1_000_000).toFixed(1)} MB`;

/** Photos to send with a booking or an inspection: checked here for type and size (the server checks the bytes again). */
export function PhotoPicker({ id, photos, max, onChange, hint }: { id: string; photos: File[]; max: number; onChange: (files: File[]) => void; hint: string }) {
  const [problems, setProblems] = useState<string[]>([]);
  const add = (list: FileList | null) => {
    const next = [...photos];
    const refused: string[] = [];
    for (const f of Array.from(list ?? [])) {
      if (!TYPES.includes(f.type)) refused.push(`${f.name} is not a JPEG, PNG or WebP image.`);
      else if (f.size > SERVICE_PHOTO_MAX_BYTES) refused.push(`${f.name} is ${mb(f.size)}; at most ${mb(SERVICE_PHOTO_MAX_BYTES)} each.`);
      else if (next.length >= max) refused.push(`${f.name} was left out: at most ${max} photos.`);
      else next.push(f);
    }
    setProblems(refused);
    onChange(next);
  };
  return (
    <div className="grid gap-2">
      <label htmlFor={id} className="font-semibold">
        Photos <span className="font-normal text-cast">(optional)</span>
      </label>
      <input
        id={id}
        type="file"
        multiple
        accept={TYPES.join(',')}
        disabled={photos.length >= max}
        aria-describedby={`${id}-hint`}
        aria-invalid={problems.length > 0 ? true : undefined}
        onChange={(e) => {
          add(e.target.files);
          e.target.value = '';
        }}
        className="min-h-11 rounded-md border border-cast-line bg-white p-2 file:mr-3 file:rounded file:border-0 file:bg-temper-tint file:px-3 file:py-1 file:font-semibold file:text-temper-deep"
      />
      <p id={`${id}-hint`} className="text-sm text-cast">
        <ImagePlus aria-hidden className="mr-1 inline size-4" />
        {hint} JPEG, PNG or WebP; up to {max}, {mb(SERVICE_PHOTO_MAX_BYTES)} each. {photos.length} of {max} chosen.
      </p>
      {problems.length > 0 && (
        <ul role="alert" className="grid gap-1 text-sm font-semibold text-oxide">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      {photos.length > 0 && (
        <ul aria-label="Photos to send" className="flex flex-wrap gap-2">
          {photos.map((f, i) => (
            <li key={`${f.name}-${f.size}-${f.lastModified}`} className="flex items-center gap-2 rounded border border-cast-line bg-white py-1 pl-3">
              <span className="max-w-48 truncate text-sm">{f.name}</span>
              <Button variant="quiet" className="min-h-9" onClick={() => onChange(photos.filter((_, j) => j !== i))} aria-label={`Remove ${f.name}`}>
                <X aria-hidden className="size-4" />
              </Button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
