import { zodResolver } from '@hookform/resolvers/zod';
import { AlertOctagon } from 'lucide-react';
import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import type { Bearing } from '../../../../shared/catalog';
import { APPLICATIONS } from '../../../../shared/schemas/fitment';
import { SERVICE_PHOTOS_MAX, ServiceBookingSchema, type ServiceBooking, type ServiceRequestView } from '../../../../shared/schemas/service';
import { SERVICE_SYMPTOMS, SERVICE_SYMPTOM_KEYS } from '../../../../shared/service';
import { SERIAL_PATTERN_HINT } from '../../../../shared/unit-serial';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { useErrorSummary, type SummaryField } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextAreaField, TextField } from '../../../components/ui/form';
import { ApiError } from '../../../lib/api-client';
import { useBookServiceRequest } from '../api/book-request';
import { PhotoPicker } from './photo-picker';

type FormInput = z.input<typeof ServiceBookingSchema>;

export const APPLICATION_WORDS: Record<(typeof APPLICATIONS)[number], string> = {
  street: 'Street',
  circuit: 'Circuit',
  drag: 'Drag',
  offroad: 'Off-road',
  marine: 'Marine',
};

export interface FrameChoice {
  code: string;
  name: string;
  bearingOptions: Bearing[];
  weightKg: number;
}

const FIELDS: SummaryField[] = [
  { name: 'serial', id: 'svc-serial', label: 'Serial' },
  { name: 'frameCode', id: 'svc-frame', label: 'Frame' },
  { name: 'bearing', id: 'svc-bearing', label: 'Bearing' },
  { name: 'symptoms', id: `svc-symptom-${SERVICE_SYMPTOM_KEYS[0]}`, label: 'What you noticed' },
  { name: 'symptomNotes', id: 'svc-notes', label: 'In your words' },
  { name: 'application', id: 'svc-application', label: 'How it is used' },
  { name: 'returnName', id: 'svc-name', label: 'Return to' },
  { name: 'returnLine1', id: 'svc-line1', label: 'Street address' },
  { name: 'returnCity', id: 'svc-city', label: 'Town or city' },
  { name: 'returnPostcode', id: 'svc-postcode', label: 'Postcode' },
];

/** Booking a unit in for service: its serial (or none), what it is, what is wrong, photos and where it goes back to. */
export function BookingForm({
  frames,
  defaults,
  onBooked,
}: {
  frames: FrameChoice[];
  defaults: { serial: string; returnName: string; returnLine1: string; returnCity: string; returnPostcode: string };
  onBooked: (r: ServiceRequestView) => void;
}) {
  const form = useForm<FormInput, unknown, ServiceBooking>({
    resolver: zodResolver(ServiceBookingSchema),
    defaultValues: { noSerial: false, frameCode: '', symptoms: [], symptomNotes: '', application: 'street', ...defaults },
  });
  const book = useBookServiceRequest();
  const [photos, setPhotos] = useState<File[]>([]);
  const photoId = useId();
  const noSerial = useWatch({ control: form.control, name: 'noSerial' });
  const frameCode = useWatch({ control: form.control, name: 'frameCode' });
  const frame = frames.find((f) => f.code === frameCode);
  const errors = form.formState.errors;
  const summary = useErrorSummary(form, FIELDS);
  const onSubmit = summary.handleSubmit((values) => {
    book.mutateAsync({ booking: values, photos }).then(onBooked, (err: unknown) =>
      summary.showServerError(err, err instanceof ApiError && (err.status === 413 || err.status === 415) ? err.message : undefined),
    );
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-6" aria-label="Book a unit in for service">
      {summary.shown && <ErrorSummary {...summary.props} />}

      <fieldset className="grid gap-3 rounded-md border border-cast-line bg-white p-4">
        <legend className="px-1 text-lg font-bold">The unit</legend>
        <TextField
          id="svc-serial"
          label="Serial"
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          className="part-no max-w-xs"
          disabled={noSerial === true}
          hint={`On the plate on the centre housing, like ${SERIAL_PATTERN_HINT}. The last digit is a check digit.`}
          error={errors.serial?.message}
          {...form.register('serial')}
        />
        <label className="flex min-h-11 items-center gap-3">
          <input type="checkbox" className="size-5 accent-temper" {...form.register('noSerial')} />
          <span>No serial, or not bought from us — we register it and give it a serial of ours</span>
        </label>
        <div className="grid gap-4 sm:grid-cols-3">
          <SelectField id="svc-frame" label="Frame" error={errors.frameCode?.message} {...form.register('frameCode')}>
            <option value="">Choose…</option>
            {frames.map((f) => (
              <option key={f.code} value={f.code}>
                {f.name} ({f.code})
              </option>
            ))}
          </SelectField>
          <SelectField id="svc-bearing" label="Bearing" error={errors.bearing?.message} {...form.register('bearing')}>
            <option value="">Choose…</option>
            {(frame?.bearingOptions ?? ['journal', 'ball']).map((b) => (
              <option key={b} value={b}>
                {b === 'ball' ? 'Ball bearing' : 'Journal bearing'}
              </option>
            ))}
          </SelectField>
          <SelectField id="svc-application" label="How it is used" error={errors.application?.message} {...form.register('application')}>
            {APPLICATIONS.map((a) => (
              <option key={a} value={a}>
                {APPLICATION_WORDS[a]}
              </option>
            ))}
          </SelectField>
        </div>
      </fieldset>

      <fieldset className="grid gap-2 rounded-md border border-cast-line bg-white p-4" aria-describedby={errors.symptoms ? 'svc-symptoms-error' : undefined}>
        <legend className="px-1 text-lg font-bold">What you noticed</legend>
        <div className="grid gap-1 sm:grid-cols-2">
          {SERVICE_SYMPTOM_KEYS.map((k) => (
            <label key={k} className="flex min-h-11 cursor-pointer items-center gap-3">
              <input id={`svc-symptom-${k}`} type="checkbox" value={k} className="size-5 accent-temper" {...form.register('symptoms')} />
              <span>{SERVICE_SYMPTOMS[k]}</span>
            </label>
          ))}
        </div>
        {errors.symptoms && (
          <p id="svc-symptoms-error" className="flex items-center gap-1 text-sm font-semibold text-oxide">
            <AlertOctagon aria-hidden className="size-4" /> {errors.symptoms.message}
          </p>
        )}
        <TextAreaField id="svc-notes" label="In your words" optional rows={3} maxLength={1000} hint="When it happens, what changed, hours since the last service." error={errors.symptomNotes?.message} {...form.register('symptomNotes')} />
      </fieldset>

      <PhotoPicker id={photoId} photos={photos} max={SERVICE_PHOTOS_MAX} onChange={setPhotos} hint="Show the serial plate, both wheels through the inlet and outlet, and any oil or damage." />

      <fieldset className="grid gap-4 rounded-md border border-cast-line bg-white p-4">
        <legend className="px-1 text-lg font-bold">Where it goes back to</legend>
        <TextField id="svc-name" label="Return to" autoComplete="name" error={errors.returnName?.message} {...form.register('returnName')} />
        <TextField id="svc-line1" label="Street address" autoComplete="address-line1" error={errors.returnLine1?.message} {...form.register('returnLine1')} />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField id="svc-city" label="Town or city" autoComplete="address-level2" error={errors.returnCity?.message} {...form.register('returnCity')} />
          <TextField id="svc-postcode" label="Postcode" autoComplete="postal-code" error={errors.returnPostcode?.message} {...form.register('returnPostcode')} />
        </div>
      </fieldset>

      <Caution title="Before you send it">
        <p>
          Drain the oil and cap the oil ports. Pack the unit so nothing can touch or strike the wheels. Large units weigh up to about 40 kg
          {frame ? ` (a ${frame.name} about ${frame.weightKg} kg)` : ''}: lift them with two people.
        </p>
      </Caution>

      <div>
        <Button type="submit" size="lg" disabled={book.isPending}>
          {book.isPending ? 'Booking…' : 'Book it in'}
        </Button>
      </div>
    </form>
  );
}
