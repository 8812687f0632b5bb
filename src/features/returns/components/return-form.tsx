import { zodResolver } from '@hookform/resolvers/zod';
import { AlertOctagon, ImagePlus, Info, X } from 'lucide-react';
import { useEffect, useId, useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { formatPrice } from '../../../../shared/catalog';
import type { OrderDetail } from '../../../../shared/schemas/orders';
import { RETURN_KINDS, RETURN_PHOTO_MAX_BYTES, RETURN_PHOTOS_MAX, ReturnRequestSchema, type ReturnKind, type ReturnRequest, type ReturnView } from '../../../../shared/schemas/warehouse';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useCreateReturn } from '../api/create-return';
import { checkPhotos, formatBytes, RETURN_PHOTO_TYPES } from '../lib/photo-checks';
import { ErrorSummary, TextAreaField, TextField } from '../../../components/ui/form';
import { useErrorSummary, type SummaryField } from '../../../components/ui/error-summary';

type Line = OrderDetail['lines'][number];
type FormInput = z.input<typeof ReturnRequestSchema>;

const KIND_HINTS: Record<ReturnKind, string> = {
  'wrong-part': 'It does not fit or is not what was ordered. Unfitted and in its box, please.',
  faulty: 'It fails in use or arrived damaged. Say what happens, and when.',
  core: 'Your old unit, sent back for the exchange unit you bought.',
};

function PhotoThumb({ file, onRemove }: { file: File; onRemove: () => void }) {
  const url = useMemo(() => URL.createObjectURL(file), [file]);
  useEffect(() => () => URL.revokeObjectURL(url), [url]);
  return (
    <li className="grid gap-1">
      <img src={url} alt={`Photo to send: ${file.name}`} className="aspect-square w-full rounded border border-cast-line bg-panel object-cover" />
      <span className="truncate text-sm text-cast" title={file.name}>
        {file.name} · {formatBytes(file.size)}
      </span>
      <Button variant="quiet" className="min-h-9" onClick={onRemove} aria-label={`Remove ${file.name}`}>
        <X aria-hidden className="size-4" /> Remove
      </Button>
    </li>
  );
}

/** The server's refusals of the photos themselves, in the words of the photo field; undefined for any other error. */
function photoRefusal(err: unknown): string | undefined {
  if (!(err instanceof ApiError)) return undefined;
  if (err.status === 413) return `A photo is too large: each may be at most ${formatBytes(RETURN_PHOTO_MAX_BYTES)}.`;
  if (err.status === 415) return 'One of the files is not an image we take (JPEG, PNG or WebP).';
  return undefined;
}

export function ReturnForm({ order, line, returnable, onCreated }: { order: OrderDetail; line: Line; returnable: number; onCreated: (r: ReturnView) => void }) {
  const exchange = line.condition === 'exchange';
  const kinds = (Object.keys(RETURN_KINDS) as ReturnKind[]).filter((k) => k !== 'core' || exchange);
  const form = useForm<FormInput, unknown, ReturnRequest>({
    resolver: zodResolver(ReturnRequestSchema),
    defaultValues: { orderNumber: order.number, lineId: line.id, kind: undefined, quantity: 1, reason: '' },
  });
  const create = useCreateReturn();
  const [photos, setPhotos] = useState<File[]>([]);
  const [photoProblems, setPhotoProblems] = useState<string[]>([]);
  const photoInputId = useId();
  const kind = useWatch({ control: form.control, name: 'kind' });
  const errors = form.formState.errors;
  const fields: SummaryField[] = [
    // The kind is a radio group: its link goes to the first choice.
    { name: 'kind', id: `return-kind-${kinds[0]}`, label: 'Kind of return' },
    { name: 'quantity', id: 'return-quantity', label: 'Quantity' },
    { name: 'reason', id: 'return-reason', label: 'Reason' },
  ];
  const summary = useErrorSummary(form, fields, {
    extraItems: photoProblems.length > 0 ? [{ id: photoInputId, message: `Photos: ${photoProblems.join(' ')}` }] : [],
  });

  const addPhotos = (list: FileList | null) => {
    const { accepted, problems } = checkPhotos(photos, Array.from(list ?? []));
    setPhotos([...photos, ...accepted]);
    setPhotoProblems(problems);
  };

  const onSubmit = summary.handleSubmit(
    (values) => {
      if (values.quantity > returnable) {
        form.setError('quantity', { message: `at most ${returnable} can come back from this line` });
        summary.showInvalid();
        return;
      }
      // mutateAsync rather than mutate's callbacks: the refreshed returns list can unmount this form before they would run.
      create.mutateAsync({ request: values, photos }).then(onCreated, (err: unknown) => summary.showServerError(err, photoRefusal(err)));
    },
    () => create.reset(),
  );

  const depositTotal = line.coreDepositCents * Math.max(1, Number(form.watch('quantity')) || 1);

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-6" aria-label={`Return ${line.partNumber}`}>
      {summary.shown && <ErrorSummary {...summary.props} />}

      <fieldset className="grid gap-2" aria-describedby={errors.kind ? 'return-kind-error' : undefined}>
        <legend className="mb-1 text-lg font-bold">Why is it coming back?</legend>
        {kinds.map((k) => (
          <label
            key={k}
            className={`flex cursor-pointer gap-3 rounded-md border bg-white p-3 ${kind === k ? 'border-2 border-temper' : errors.kind ? 'border-2 border-oxide' : 'border-cast-line'}`}
          >
            <input
              id={`return-kind-${k}`}
              type="radio"
              value={k}
              className="mt-1 accent-temper"
              {...form.register('kind', {
                onChange: (e: { target: { value: string } }) => {
                  if (e.target.value === 'core' && !form.getValues('reason')) form.setValue('reason', 'Returning the old unit as the exchange core.');
                },
              })}
            />
            <span>
              <span className="font-semibold">{RETURN_KINDS[k]}</span>
              <span className="block text-sm text-cast">{KIND_HINTS[k]}</span>
            </span>
          </label>
        ))}
        {!exchange && <p className="text-sm text-cast">An exchange core can only be returned against an exchange unit; this part was sold new.</p>}
        {errors.kind?.message && (
          <p id="return-kind-error" className="flex items-center gap-1 text-sm font-semibold text-oxide">
            <AlertOctagon aria-hidden className="size-4" /> {errors.kind.message}
          </p>
        )}
      </fieldset>

      {kind === 'core' && (
        <div role="note" className="flex gap-3 rounded-md border border-temper bg-temper-tint p-4">
          <Info aria-hidden className="mt-0.5 size-5 shrink-0 text-temper" />
          <div>
            <p className="font-semibold">How the core deposit comes back</p>
            <p>
              You paid a core deposit of <span className="tabular font-semibold">{formatPrice(line.coreDepositCents)}</span> per unit. Once the old unit reaches us, the
              warehouse inspects it; a complete, rebuildable core gets the deposit back (<span className="tabular font-semibold">{formatPrice(depositTotal)}</span> for this
              return) {order.paymentMethod === 'account' ? 'as a credit note on your trade account' : 'to the card you paid with'}. A cracked housing or a seized, scrap core may
              be refused. Drain the oil and cap the ports before packing it.
            </p>
          </div>
        </div>
      )}

      <div className="grid gap-4 sm:grid-cols-[10rem_1fr]">
        <TextField
          id="return-quantity"
          label="Quantity"
          inputMode="numeric"
          autoComplete="off"
          hint={`Up to ${returnable}`}
          error={errors.quantity?.message}
          {...form.register('quantity')}
        />
        <TextAreaField
          id="return-reason"
          label="Reason"
          rows={3}
          maxLength={500}
          hint="What is wrong, in a sentence or two. For a core, say so."
          error={errors.reason?.message}
          {...form.register('reason')}
        />
      </div>

      <div className="grid gap-2">
        <label htmlFor={photoInputId} className="font-semibold">
          Photos <span className="font-normal text-cast">(optional)</span>
        </label>
        <input
          id={photoInputId}
          type="file"
          multiple
          accept={RETURN_PHOTO_TYPES.join(',')}
          disabled={photos.length >= RETURN_PHOTOS_MAX}
          aria-describedby={`${photoInputId}-hint`}
          aria-invalid={photoProblems.length > 0 ? true : undefined}
          onChange={(e) => {
            addPhotos(e.target.files);
            e.target.value = '';
          }}
          className="min-h-11 rounded-md border border-cast-line bg-white p-2 file:mr-3 file:rounded file:border-0 file:bg-temper-tint file:px-3 file:py-1 file:font-semibold file:text-temper-deep"
        />
        <p id={`${photoInputId}-hint`} className="text-sm text-cast">
          <ImagePlus aria-hidden className="mr-1 inline size-4" />
          JPEG, PNG or WebP; up to {RETURN_PHOTOS_MAX} photos, {formatBytes(RETURN_PHOTO_MAX_BYTES)} each. Show the part number label and any damage. {photos.length} of {RETURN_PHOTOS_MAX}{' '}
          chosen.
        </p>
        {photoProblems.length > 0 && (
          <ul role="alert" className="grid gap-1 text-sm font-semibold text-oxide">
            {photoProblems.map((p) => (
              <li key={p} className="flex items-center gap-1">
                <AlertOctagon aria-hidden className="size-4 shrink-0" /> {p}
              </li>
            ))}
          </ul>
        )}
        {photos.length > 0 && (
          <ul aria-label="Photos to send" className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            {photos.map((f, i) => (
              <PhotoThumb key={`${f.name}-${f.size}-${f.lastModified}`} file={f} onRemove={() => setPhotos(photos.filter((_, j) => j !== i))} />
            ))}
          </ul>
        )}
      </div>

      <div>
        <Button type="submit" size="lg" disabled={create.isPending}>
          {create.isPending ? 'Sending…' : 'Ask to return it'}
        </Button>
      </div>
    </form>
  );
}
