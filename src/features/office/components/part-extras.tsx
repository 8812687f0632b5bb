import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, CircleHelp, ImagePlus, LoaderCircle, X } from 'lucide-react';
import { useEffect, useId, useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { PART_PHOTO_MAX_BYTES, PartLinksSchema, SupersedeSchema } from '../../../../shared/schemas/admin-catalog';
import { formatPrice } from '../../../../shared/catalog';
import type { AdminPart } from '../../../../shared/schemas/office-views';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useLookupPart } from '../api/lookup-part';
import { useSetPartLinks } from '../api/set-part-links';
import { useSupersedePart } from '../api/supersede-part';
import { useUploadPartPhoto } from '../api/upload-part-photo';
import { formatBytes } from '../lib/money';
import { TextField } from '../../../components/ui/form';

function Panel({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="grid content-start gap-3 rounded-lg bg-white p-5 ring-1 ring-cast-line">
      <h2 id={id} className="text-lg font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

function useDebounced<T>(value: T, ms = 250): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/** What the typed part number is, as the user types: found (title and price), not found, or still looking. */
function LookupResult({ partNumber, id, self }: { partNumber: string; id: string; self: string }) {
  const lookup = useLookupPart(partNumber);
  if (partNumber.length < 4) return null;
  if (partNumber === self)
    return (
      <p id={id} className="flex items-center gap-1 text-sm font-semibold text-oxide">
        <X aria-hidden className="size-4" /> That is this part.
      </p>
    );
  if (lookup.isPending)
    return (
      <p id={id} className="flex items-center gap-1 text-sm text-cast">
        <LoaderCircle aria-hidden className="size-4 animate-spin" /> Looking up {partNumber}…
      </p>
    );
  if (lookup.isError)
    return (
      <p id={id} className="flex items-center gap-1 text-sm font-semibold text-oxide">
        <CircleHelp aria-hidden className="size-4" />
        {lookup.error instanceof ApiError && lookup.error.isNotFound ? `No part ${partNumber} in the catalogue.` : lookup.error.message}
      </p>
    );
  return (
    <p id={id} className="flex items-center gap-1 text-sm text-machined">
      <CircleCheck aria-hidden className="size-4" />
      <span>
        Found: <span className="part-no">{lookup.data.partNumber}</span> {lookup.data.title} · <span className="tabular">{formatPrice(lookup.data.priceCents)}</span>
      </span>
    </p>
  );
}

export function SupersedePanel({ part }: { part: AdminPart }) {
  const form = useForm({ resolver: zodResolver(SupersedeSchema), defaultValues: { replacedBy: part.supersededBy ?? '' } });
  const supersede = useSupersedePart(part.partNumber);
  const typed = useDebounced(form.watch('replacedBy').trim().toUpperCase());
  const lookupId = useId();
  const onSubmit = form.handleSubmit((v) => supersede.mutate(v.replacedBy.trim().toUpperCase()));
  return (
    <Panel title="Supersede" id="supersede-heading">
      {part.supersededBy ? (
        <p>
          <span className="part-no">{part.partNumber}</span> is superseded by <span className="part-no">{part.supersededBy}</span>. Buyers see the replacement on its page.
        </p>
      ) : (
        <p className="text-cast">When a newer part replaces this one, name it here. Buyers are sent to the replacement.</p>
      )}
      <form noValidate onSubmit={onSubmit} className="grid gap-3" aria-label="Supersede this part">
        <TextField
          id="supersede-replacedBy"
          label="Replaced by"
          error={form.formState.errors.replacedBy?.message ?? (supersede.isError ? supersede.error.message : undefined)}
          autoComplete="off"
          className="part-no uppercase"
          aria-describedby={lookupId}
          {...form.register('replacedBy')}
        />
        <div aria-live="polite">
          <LookupResult partNumber={typed} id={lookupId} self={part.partNumber} />
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" variant="secondary" disabled={supersede.isPending}>
            {supersede.isPending ? 'Saving…' : 'Supersede'}
          </Button>
          {supersede.isSuccess && (
            <p role="status" className="flex items-center gap-1 font-semibold text-machined">
              <CircleCheck aria-hidden className="size-4" /> Superseded.
            </p>
          )}
        </div>
      </form>
    </Panel>
  );
}

function LinkedPart({ partNumber, onRemove }: { partNumber: string; onRemove: () => void }) {
  const lookup = useLookupPart(partNumber);
  return (
    <li className="flex items-center justify-between gap-3 border-b border-cast-line py-2 last:border-b-0">
      <span className="min-w-0">
        <span className="part-no">{partNumber}</span>{' '}
        <span className="text-cast">{lookup.data?.title ?? (lookup.isError ? '(not in the catalogue)' : '')}</span>
      </span>
      <Button variant="quiet" className="min-h-9 shrink-0" onClick={onRemove} aria-label={`Remove ${partNumber}`}>
        <X aria-hidden className="size-4" /> Remove
      </Button>
    </li>
  );
}

export function LinksPanel({ part }: { part: AdminPart }) {
  const [links, setLinks] = useState<string[]>(part.goesWith);
  const [draft, setDraft] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const save = useSetPartLinks(part.partNumber);
  const typed = useDebounced(draft.trim().toUpperCase());
  const lookup = useLookupPart(typed);
  const lookupId = useId();
  const dirty = links.join(',') !== part.goesWith.join(',');

  const add = () => {
    const pn = draft.trim().toUpperCase();
    setMessage(null);
    if (!pn) return setMessage('Type a part number first.');
    if (pn === part.partNumber) return setMessage('A part cannot go with itself.');
    if (links.includes(pn)) return setMessage(`${pn} is already on the list.`);
    const parsed = PartLinksSchema.safeParse({ partNumbers: [...links, pn] });
    if (!parsed.success) return setMessage(parsed.error.issues[0]?.message ?? 'That part number is not valid.');
    if (lookup.isError || (lookup.data && lookup.data.partNumber !== pn && typed === pn)) return setMessage(`No part ${pn} in the catalogue.`);
    setLinks([...links, pn]);
    setDraft('');
  };

  return (
    <Panel title="Goes with" id="links-heading">
      <p className="text-cast">Parts a buyer usually needs with this one (gaskets, lines, actuators). They show on the part page.</p>
      {links.length === 0 ? (
        <p className="rounded border border-dashed border-cast-line p-3 text-cast">Nothing linked yet.</p>
      ) : (
        <ul aria-label="Parts that go with this one">
          {links.map((pn) => (
            <LinkedPart key={pn} partNumber={pn} onRemove={() => setLinks(links.filter((l) => l !== pn))} />
          ))}
        </ul>
      )}
      <div className="grid gap-2">
        <div className="flex items-end gap-2">
          <div className="flex-1">
            <TextField
              id="links-add"
              label="Add a part number"
              value={draft}
              onChange={(e) => setDraft(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === 'Enter') {
                  e.preventDefault();
                  add();
                }
              }}
              error={message ?? undefined}
              autoComplete="off"
              className="part-no uppercase"
              aria-describedby={lookupId}
            />
          </div>
          <Button variant="secondary" onClick={add} className="min-h-11">
            Add
          </Button>
        </div>
        <div aria-live="polite">
          <LookupResult partNumber={typed} id={lookupId} self={part.partNumber} />
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={() => save.mutate(links)} disabled={!dirty || save.isPending}>
          {save.isPending ? 'Saving…' : 'Save links'}
        </Button>
        {!dirty && !save.isSuccess && <p className="text-sm text-cast">No changes to save.</p>}
        {save.isSuccess && !dirty && (
          <p role="status" className="flex items-center gap-1 font-semibold text-machined">
            <CircleCheck aria-hidden className="size-4" /> Links saved.
          </p>
        )}
        {save.isError && (
          <p role="alert" className="font-semibold text-oxide">
            {save.error.message}
          </p>
        )}
      </div>
    </Panel>
  );
}

const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'];

export function PhotosPanel({ part }: { part: AdminPart }) {
  const upload = useUploadPartPhoto(part.partNumber);
  const [problem, setProblem] = useState<string | null>(null);
  const inputId = useId();
  const images = upload.data?.images ?? part.images;

  const onFile = (file: File | undefined) => {
    setProblem(null);
    if (!file) return;
    if (!PHOTO_TYPES.includes(file.type)) return setProblem(`${file.name} is not a JPEG, PNG or WebP image.`);
    if (file.size > PART_PHOTO_MAX_BYTES) return setProblem(`${file.name} is ${formatBytes(file.size)}; photos may be at most ${formatBytes(PART_PHOTO_MAX_BYTES)}.`);
    upload.mutate(file);
  };

  return (
    <Panel title="Photos" id="photos-heading">
      {images.length === 0 ? (
        <p className="rounded border border-dashed border-cast-line p-3 text-cast">No photos yet. Buyers see a drawing of the category instead.</p>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label="Photos of this part">
          {images.map((name, i) => (
            <li key={name}>
              <img src={`/api/parts/photos/${encodeURIComponent(name)}`} alt={`${part.partNumber}, photo ${i + 1}`} className="aspect-square w-full rounded border border-cast-line bg-panel object-cover" />
            </li>
          ))}
        </ul>
      )}
      <div className="grid gap-1">
        <label htmlFor={inputId} className="font-semibold">
          Add a photo
        </label>
        <input
          id={inputId}
          type="file"
          accept={PHOTO_TYPES.join(',')}
          aria-describedby={`${inputId}-hint`}
          disabled={upload.isPending}
          onChange={(e) => {
            onFile(e.target.files?.[0]);
            e.target.value = '';
          }}
          className="min-h-11 rounded-md border border-cast-line bg-white p-2 file:mr-3 file:rounded file:border-0 file:bg-temper-tint file:px-3 file:py-1 file:font-semibold file:text-temper-deep"
        />
        <p id={`${inputId}-hint`} className="text-sm text-cast">
          JPEG, PNG or WebP, at most {formatBytes(PART_PHOTO_MAX_BYTES)}. A plain background and the flanges in view help buyers most.
        </p>
      </div>
      <div aria-live="polite">
        {upload.isPending && (
          <p className="flex items-center gap-1 text-cast">
            <ImagePlus aria-hidden className="size-4" /> Uploading…
          </p>
        )}
        {upload.isSuccess && (
          <p className="flex items-center gap-1 font-semibold text-machined">
            <CircleCheck aria-hidden className="size-4" /> Photo added.
          </p>
        )}
        {(problem || upload.isError) && (
          <p role="alert" className="flex items-center gap-1 font-semibold text-oxide">
            <X aria-hidden className="size-4" /> {problem ?? upload.error?.message}
          </p>
        )}
      </div>
    </Panel>
  );
}
