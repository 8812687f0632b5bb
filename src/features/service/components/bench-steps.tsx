import { zodResolver } from '@hookform/resolvers/zod';
import { Plus, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { formatPrice } from '../../../../shared/catalog';
import { InspectionSchema, QuoteSchema, RebuildSchema, SERVICE_PHOTOS_MAX, ServiceShipSchema, type BenchRequest, type Inspection, type Quote, type Rebuild, type ServiceShip } from '../../../../shared/schemas/service';
import { CARRIERS } from '../../../../shared/schemas/warehouse';
import { WHEEL_DAMAGE, WHEEL_DAMAGE_KEYS } from '../../../../shared/service';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/form';
import { useInspect, useQuote, useRebuild, useShip } from '../api/bench-actions';
import { PhotoPicker } from './photo-picker';

function Refused({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded border-l-4 border-oxide bg-oxide-tint p-3 text-lg font-semibold text-oxide">
      {message}
    </p>
  );
}
const msg = (e: { message?: string | undefined } | undefined) => e?.message;

/** Findings: shaft play against the frame's limits, wheel damage, oil and carbon, cracks, notes and photos. */
export function InspectForm({ data }: { data: BenchRequest }) {
  const r = data.request;
  const inspect = useInspect();
  const [photos, setPhotos] = useState<File[]>([]);
  const [refused, setRefused] = useState<string | null>(null);
  const form = useForm<z.input<typeof InspectionSchema>, unknown, Inspection>({
    resolver: zodResolver(InspectionSchema),
    defaultValues: r.inspection
      ? { ...r.inspection, axialPlayMm: String(r.inspection.axialPlayMm), radialPlayMm: String(r.inspection.radialPlayMm) }
      : { axialPlayMm: '', radialPlayMm: '', compressorWheel: 'none', turbineWheel: 'none', oilCompressorSide: false, oilTurbineSide: false, carbonTurbineSide: false, housingCracks: false, notes: '' },
  });
  const axial = Number(useWatch({ control: form.control, name: 'axialPlayMm' }));
  const radial = Number(useWatch({ control: form.control, name: 'radialPlayMm' }));
  const over = (v: number, limit: number) => Number.isFinite(v) && v > limit;
  const e = form.formState.errors;
  const submit = form.handleSubmit((values) => {
    setRefused(null);
    inspect.mutate({ reference: r.reference, inspection: values, photos }, { onSuccess: () => setPhotos([]), onError: (err) => setRefused(err.message) });
  });
  return (
    <form noValidate onSubmit={submit} aria-labelledby="bench-inspect" className="grid gap-4">
      <h3 id="bench-inspect" className="text-xl font-bold">
        {r.inspection ? 'Inspection (recorded; correct it before quoting)' : 'Inspect'}
      </h3>
      <Refused message={refused} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          variant="floor"
          id="insp-axial"
          label="Shaft play, axial"
          inputMode="decimal"
          suffix="mm"
          hint={`Limit ${data.limits.axial} mm for this frame and bearing${over(axial, data.limits.axial) ? ' — OVER THE LIMIT' : ''}`}
          error={msg(e.axialPlayMm)}
          {...form.register('axialPlayMm')}
        />
        <TextField
          variant="floor"
          id="insp-radial"
          label="Shaft play, radial"
          inputMode="decimal"
          suffix="mm"
          hint={`Limit ${data.limits.radial} mm${over(radial, data.limits.radial) ? ' — OVER THE LIMIT' : ''}`}
          error={msg(e.radialPlayMm)}
          {...form.register('radialPlayMm')}
        />
        <SelectField variant="floor" id="insp-cw" label="Compressor wheel damage" error={msg(e.compressorWheel)} {...form.register('compressorWheel')}>
          {WHEEL_DAMAGE_KEYS.map((k) => (
            <option key={k} value={k}>
              {WHEEL_DAMAGE[k]}
            </option>
          ))}
        </SelectField>
        <SelectField variant="floor" id="insp-tw" label="Turbine wheel damage" error={msg(e.turbineWheel)} {...form.register('turbineWheel')}>
          {WHEEL_DAMAGE_KEYS.map((k) => (
            <option key={k} value={k}>
              {WHEEL_DAMAGE[k]}
            </option>
          ))}
        </SelectField>
      </div>
      <fieldset className="grid gap-1 sm:grid-cols-2">
        <legend className="mb-1 text-lg font-semibold">Found</legend>
        {(
          [
            ['oilCompressorSide', 'Oil on the compressor side'],
            ['oilTurbineSide', 'Oil on the turbine side'],
            ['carbonTurbineSide', 'Carbon on the turbine side'],
            ['housingCracks', 'Cracks in a housing'],
          ] as const
        ).map(([name, label]) => (
          <label key={name} className="flex min-h-12 items-center gap-3 text-lg">
            <input type="checkbox" className="size-6 accent-temper" {...form.register(name)} />
            {label}
          </label>
        ))}
      </fieldset>
      <TextAreaField variant="floor" id="insp-notes" label="Notes" optional rows={2} maxLength={1000} error={msg(e.notes)} {...form.register('notes')} />
      <PhotoPicker id="insp-photos" photos={photos} max={SERVICE_PHOTOS_MAX} onChange={setPhotos} hint="Wheels, bearing housing, any cracks." />
      <div>
        <Button type="submit" size="lg" disabled={inspect.isPending}>
          {inspect.isPending ? 'Recording…' : 'Record the inspection'}
        </Button>
      </div>
    </form>
  );
}

type QuoteInput = z.input<typeof QuoteSchema>;

/** Quote lines from the catalogue (the kits that go with the unit offered first), labour and balancing. */
export function QuoteForm({ data }: { data: BenchRequest }) {
  const r = data.request;
  const quote = useQuote();
  const [refused, setRefused] = useState<string | null>(null);
  const form = useForm<QuoteInput, unknown, Quote>({ resolver: zodResolver(QuoteSchema), defaultValues: { lines: [], labourHours: 1.5, balancing: true, notes: '' } });
  const lines = useFieldArray({ control: form.control, name: 'lines' });
  const hours = Number(useWatch({ control: form.control, name: 'labourHours' })) || 0;
  const balancing = useWatch({ control: form.control, name: 'balancing' });
  const e = form.formState.errors;
  const submit = form.handleSubmit((values) => {
    setRefused(null);
    quote.mutate({ reference: r.reference, quote: values }, { onError: (err) => setRefused(err.message) });
  });
  return (
    <form noValidate onSubmit={submit} aria-labelledby="bench-quote" className="grid gap-4">
      <h3 id="bench-quote" className="text-xl font-bold">
        Quote
      </h3>
      <Refused message={refused} />
      <div className="grid gap-2">
        <p className="text-lg font-semibold">Rebuild kits that go with this unit</p>
        {data.suggestedKits.length === 0 ? (
          <p className="text-cast">None listed for this frame yet: add parts by number below.</p>
        ) : (
          <ul className="flex flex-wrap gap-2">
            {data.suggestedKits.map((k) => (
              <li key={k.partNumber}>
                <Button variant="secondary" className="min-h-12" onClick={() => lines.append({ partNumber: k.partNumber, quantity: 1 })}>
                  <Plus aria-hidden className="size-4" /> <span className="part-no">{k.partNumber}</span> {k.title} · {formatPrice(k.priceCents)} · {k.available} free
                </Button>
              </li>
            ))}
          </ul>
        )}
      </div>
      <fieldset className="grid gap-3">
        <legend className="mb-1 text-lg font-semibold">Parts</legend>
        {lines.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-[minmax(0,1fr)_6rem_auto] items-end gap-2">
            <TextField variant="floor" id={`quote-part-${i}`} label={`Part number, line ${i + 1}`} autoComplete="off" className="part-no" error={msg(e.lines?.[i]?.partNumber)} {...form.register(`lines.${i}.partNumber`)} />
            <TextField variant="floor" id={`quote-qty-${i}`} label="Qty" inputMode="numeric" error={msg(e.lines?.[i]?.quantity)} {...form.register(`lines.${i}.quantity`, { valueAsNumber: true })} />
            <Button variant="quiet" className="min-h-12" onClick={() => lines.remove(i)} aria-label={`Remove line ${i + 1}`}>
              <Trash2 aria-hidden className="size-5" />
            </Button>
          </div>
        ))}
        {e.lines?.message && <p className="font-semibold text-oxide">{e.lines.message}</p>}
        {e.lines?.root?.message && <p className="font-semibold text-oxide">{e.lines.root.message}</p>}
        <div>
          <Button variant="secondary" className="min-h-12" onClick={() => lines.append({ partNumber: '', quantity: 1 })}>
            <Plus aria-hidden className="size-4" /> Add a part line
          </Button>
        </div>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          variant="floor"
          id="quote-hours"
          label="Labour"
          inputMode="decimal"
          suffix="h"
          hint={`At ${formatPrice(data.labourRateCents)} an hour: ${formatPrice(Math.round(hours * data.labourRateCents))}. Return carriage included.`}
          error={msg(e.labourHours)}
          {...form.register('labourHours', { valueAsNumber: true })}
        />
        <label className="flex min-h-12 items-center gap-3 self-center text-lg">
          <input type="checkbox" className="size-6 accent-temper" {...form.register('balancing')} />
          Balancing ({formatPrice(balancing ? data.balancingCents : 0)})
        </label>
      </div>
      <TextAreaField variant="floor" id="quote-notes" label="Note to the customer" optional rows={2} maxLength={1000} {...form.register('notes')} />
      <p className="text-cast">Parts are priced at the customer's prices (trade discount for dealers); tax is added on parts, labour and balancing. The customer is e-mailed.</p>
      <div>
        <Button type="submit" size="lg" disabled={quote.isPending}>
          {quote.isPending ? 'Sending…' : 'Send the quote'}
        </Button>
      </div>
    </form>
  );
}

type RebuildInput = z.input<typeof RebuildSchema>;

/** The rebuild: the quoted parts leave stock; balance before and after, and the test record. */
export function RebuildForm({ data }: { data: BenchRequest }) {
  const r = data.request;
  const rebuild = useRebuild();
  const [refused, setRefused] = useState<string | null>(null);
  const form = useForm<RebuildInput, unknown, Rebuild>({
    resolver: zodResolver(RebuildSchema),
    defaultValues: { balance: { checkSpeedRpm: 2400 }, test: { leakCheck: 'pass', result: 'pass', notes: '' } },
  });
  const e = form.formState.errors;
  const num = { valueAsNumber: true } as const;
  const submit = form.handleSubmit((values) => {
    setRefused(null);
    rebuild.mutate({ reference: r.reference, rebuild: values }, { onError: (err) => setRefused(err.message) });
  });
  const limit = data.limits.balancePerPlaneGmm;
  return (
    <form noValidate onSubmit={submit} aria-labelledby="bench-rebuild" className="grid gap-4">
      <h3 id="bench-rebuild" className="text-xl font-bold">
        Rebuild, balance and test
      </h3>
      <Caution title="Working safely">
        <p>
          Wheels are sharp: never touch them while they spin. Prime the oil supply before the first start on the test stand. The largest units weigh
          about 40 kg: lift them with two people. Fitting to a vehicle is for a licensed mechanic, to local rules.
        </p>
      </Caution>
      <div className="rounded-md bg-panel p-3">
        <p className="text-lg font-semibold">Parts that leave stock</p>
        <ul className="list-disc pl-5">
          {(r.quote?.lines ?? []).map((l) => (
            <li key={l.partNumber}>
              {l.quantity} × <span className="part-no">{l.partNumber}</span> {l.title}
            </li>
          ))}
        </ul>
      </div>
      <Refused message={refused} />
      <fieldset className="grid gap-3">
        <legend className="mb-1 text-lg font-semibold">Residual unbalance (g·mm per correction plane)</legend>
        <p className="text-cast">
          Pass limit {limit} g·mm per plane: grade G 2.5 of ISO 21940-11 for a {data.limits.rotorMassKg} kg rotor at its {data.limits.maxShaftRpm.toLocaleString('en-US')} rpm limit, split over two planes.
        </p>
        <TextField variant="floor" id="bal-speed" label="Check speed" inputMode="numeric" suffix="rpm" error={msg(e.balance?.checkSpeedRpm)} {...form.register('balance.checkSpeedRpm', num)} />
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField variant="floor" id="bal-before-c" label="Before, compressor plane" inputMode="decimal" suffix="g·mm" error={msg(e.balance?.before?.compressorGmm)} {...form.register('balance.before.compressorGmm', num)} />
          <TextField variant="floor" id="bal-before-t" label="Before, turbine plane" inputMode="decimal" suffix="g·mm" error={msg(e.balance?.before?.turbineGmm)} {...form.register('balance.before.turbineGmm', num)} />
          <TextField variant="floor" id="bal-after-c" label="After, compressor plane" inputMode="decimal" suffix="g·mm" error={msg(e.balance?.after?.compressorGmm)} {...form.register('balance.after.compressorGmm', num)} />
          <TextField variant="floor" id="bal-after-t" label="After, turbine plane" inputMode="decimal" suffix="g·mm" error={msg(e.balance?.after?.turbineGmm)} {...form.register('balance.after.turbineGmm', num)} />
        </div>
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-1 text-lg font-semibold">Test record</legend>
        <TextField variant="floor" id="test-oil" label="Oil pressure at test" inputMode="decimal" suffix="kPa" error={msg(e.test?.oilPressureKpa)} {...form.register('test.oilPressureKpa', num)} />
        <TextField variant="floor" id="test-float" label="End float after rebuild" inputMode="decimal" suffix="mm" hint={`Limit ${data.limits.axial} mm`} error={msg(e.test?.endFloatMm)} {...form.register('test.endFloatMm')} />
        <SelectField variant="floor" id="test-leak" label="Leak check" error={msg(e.test?.leakCheck)} {...form.register('test.leakCheck')}>
          <option value="pass">Pass: no leak</option>
          <option value="fail">Fail: leaks</option>
        </SelectField>
        <SelectField variant="floor" id="test-result" label="Test result" error={msg(e.test?.result)} {...form.register('test.result')}>
          <option value="pass">Pass</option>
          <option value="fail">Fail</option>
        </SelectField>
      </fieldset>
      <div>
        <Button type="submit" size="lg" disabled={rebuild.isPending}>
          {rebuild.isPending ? 'Recording…' : 'Record the rebuild and take the parts from stock'}
        </Button>
      </div>
    </form>
  );
}

/** Ships the unit back: carrier and tracking; the invoice is issued and the customer e-mailed. */
export function ShipForm({ data }: { data: BenchRequest }) {
  const r = data.request;
  const ship = useShip();
  const [refused, setRefused] = useState<string | null>(null);
  const form = useForm<z.input<typeof ServiceShipSchema>, unknown, ServiceShip>({ resolver: zodResolver(ServiceShipSchema), defaultValues: { trackingNumber: '' } });
  const e = form.formState.errors;
  const submit = form.handleSubmit((values) => {
    setRefused(null);
    ship.mutate({ reference: r.reference, ship: values }, { onError: (err) => setRefused(err.message) });
  });
  return (
    <form noValidate onSubmit={submit} aria-labelledby="bench-ship" className="grid gap-4">
      <h3 id="bench-ship" className="text-xl font-bold">
        Ship back {r.status === 'declined' ? 'unrepaired' : ''}
      </h3>
      <p className="text-lg">
        To {r.returnAddress.name}, {r.returnAddress.line1}, {r.returnAddress.city} {r.returnAddress.postcode}. Invoice:{' '}
        {r.chargeCents > 0 ? `${formatPrice(r.chargeCents)} ${r.paymentState === 'paid' ? '(paid by card)' : '(on account)'}` : 'none'}.
      </p>
      <Caution title="Packing it">
        <p>Drain and cap the oil ports, guard both wheels, and lift heavy units with two people.</p>
      </Caution>
      <Refused message={refused} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField variant="floor" id="ship-carrier" label="Carrier" error={msg(e.carrier)} {...form.register('carrier')}>
          <option value="">Choose…</option>
          {CARRIERS.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </SelectField>
        <TextField variant="floor" id="ship-tracking" label="Tracking number" autoComplete="off" className="part-no" error={msg(e.trackingNumber)} {...form.register('trackingNumber')} />
      </div>
      <div>
        <Button type="submit" size="lg" disabled={ship.isPending}>
          {ship.isPending ? 'Recording…' : 'Ship and invoice'}
        </Button>
      </div>
    </form>
  );
}
