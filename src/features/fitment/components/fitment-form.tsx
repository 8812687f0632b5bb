import { zodResolver } from '@hookform/resolvers/zod';
import { ChevronRight } from 'lucide-react';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { useForm, type FieldErrors, type Resolver, type UseFormRegisterReturn } from 'react-hook-form';
import { defaultAfr, defaultBsfcLbPerHpH } from '../../../../shared/fitment/airflow';
import {
  APPLICATION_DEFAULTS,
  DEFAULT_AMBIENT_C,
  DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED,
  DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER,
  DEFAULT_COMPRESSOR_EFFICIENCY,
  DEFAULT_INLET_LOSS_PSI,
  DEFAULT_VOLUMETRIC_EFFICIENCY,
} from '../../../../shared/fitment/defaults';
import {
  APPLICATIONS,
  DISPLACEMENT_UNITS,
  FUELS,
  FitmentRequestSchema,
  type Application,
  type DisplacementUnit,
  type FitmentRequest,
  type FitmentRequestInput,
  type Fuel,
} from '../../../../shared/schemas/fitment';
import { Button } from '../../../components/ui/button';
import { useErrorSummary, type SummaryField } from '../../../components/ui/error-summary';
import { ErrorSummary } from '../../../components/ui/form';
import { DISPLACEMENT_UNIT_LABELS, rememberDisplacementUnit } from '../lib/displacement-unit';
import {
  ADVANCED_FIELDS,
  displacementSystem,
  formFieldOf,
  formToRequest,
  NUMERIC_FIELDS,
  rangeMessage,
  requestToForm,
  show,
  systemFor,
  type FitmentFormValues,
  type FormField,
  type NumericField,
  type UnitSystem,
} from '../lib/units';
import { UnitSwitch } from './unit-switch';

export const FUEL_LABELS: Record<Fuel, string> = { petrol: 'Petrol (gasoline)', e85: 'E85', methanol: 'Methanol', diesel: 'Diesel' };
export const APPLICATION_LABELS: Record<Application, string> = {
  street: 'Street',
  circuit: 'Circuit (track days, racing)',
  drag: 'Drag racing',
  offroad: 'Off-road',
  marine: 'Marine',
};

export { formValuesFor } from '../lib/form-values';

const fieldId = (name: FormField) => `fitment-${name}`;
const fieldOfId = (id: string) => id.replace(/^fitment-/, '') as FormField;

/** The fields in the order the form shows them; the messages name their field, so they stand without a label. */
const SUMMARY_FIELDS: readonly SummaryField[] = (
  ['displacement', 'power', 'rpm', 'fuel', 'application', 'altitude', 'inletTemp', 'intercooled', 'intercoolerEffectiveness', 'manifoldTemp', 'bsfc', 'afr', 'cylinders', 'volumetricEfficiency', 'compressorEfficiency', 'chargeLoss', 'inletLoss', 'fullBoostRpm'] satisfies FormField[]
).map((name) => ({ name, id: fieldId(name) }));
const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

function flatten(errors: FieldErrors, prefix = ''): Array<[string, string]> {
  const out: Array<[string, string]> = [];
  for (const [key, value] of Object.entries(errors)) {
    if (!value || typeof value !== 'object') continue;
    const path = prefix ? `${prefix}.${key}` : key;
    if ('message' in value && typeof value.message === 'string') out.push([path, value.message]);
    else out.push(...flatten(value as FieldErrors, path));
  }
  return out;
}

/**
 * The message a field shows: the shared schema's words, with ranges restated in the units on screen. Other words
 * (a refusal of an impossible power per litre, a whole number wanted) are the schema's own, as the server says them.
 */
function messageFor(field: FormField, schemaMessage: string, values: FitmentFormValues, system: UnitSystem): string {
  if (field in NUMERIC_FIELDS) {
    const numeric = field as NumericField;
    const text = values[numeric].trim();
    if (text === '') return capitalise(schemaMessage);
    if (Number.isNaN(Number(text.replace(/,/g, '')))) return `${NUMERIC_FIELDS[numeric].label} must be a number`;
    if (schemaMessage.includes('must be between')) return capitalise(rangeMessage(numeric, systemFor(numeric, system, values.displacementUnit)));
  }
  return capitalise(schemaMessage);
}

/** Validates with the shared request schema after converting the form to the API's units. */
function fitmentResolver(systemRef: { current: UnitSystem }): Resolver<FitmentFormValues> {
  const schemaResolver = zodResolver(FitmentRequestSchema);
  return async (values, context) => {
    const system = systemRef.current;
    const body = formToRequest(values, system) as FitmentRequestInput;
    const result = await schemaResolver(body, context, { fields: {}, shouldUseNativeValidation: false });
    const errors: Partial<Record<FormField, { type: string; message: string }>> = {};
    for (const [path, message] of flatten(result.errors)) {
      const field = formFieldOf(path);
      if (field && !errors[field]) errors[field] = { type: 'validate', message: messageFor(field, message, values, system) };
    }
    // The schema checks power only once everything else parses; say it at once.
    if (values.power.trim() === '' && !errors.power) errors.power = { type: 'required', message: 'Power is required' };
    return Object.keys(errors).length === 0 ? { values, errors: {} } : { values: {}, errors: errors as FieldErrors<FitmentFormValues> };
  };
}

function Field({
  name,
  label,
  hint,
  unit,
  addon,
  error,
  registration,
}: {
  name: FormField;
  label: string;
  hint?: ReactNode;
  unit?: string;
  /** A control beside the field (the displacement's unit), in place of a fixed unit. */
  addon?: ReactNode;
  error?: string;
  registration: UseFormRegisterReturn;
}) {
  const id = fieldId(name);
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className="grid content-start gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <div className={`flex items-stretch ${addon ? 'max-w-xs gap-2' : ''}`}>
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          {...registration}
          className={`tabular min-h-11 w-full min-w-0 rounded-l-md border bg-white px-3 text-ink ${unit ? '' : 'rounded-r-md'} ${
            error ? 'border-oxide ring-1 ring-oxide' : 'border-cast-line focus:border-temper'
          }`}
        />
        {unit && (
          <span className="inline-flex min-w-14 shrink-0 items-center justify-center rounded-r-md border border-l-0 border-cast-line bg-panel px-2 text-sm whitespace-nowrap text-cast">
            {unit}
          </span>
        )}
        {addon}
      </div>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-cast">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-sm font-semibold text-oxide">
          {error}
        </p>
      )}
    </div>
  );
}

function SelectField({ name, label, hint, options, registration }: {
  name: FormField;
  label: string;
  hint?: string;
  options: Array<[string, string]>;
  registration: UseFormRegisterReturn;
}) {
  const id = fieldId(name);
  return (
    <div className="grid content-start gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <select id={id} {...registration} aria-describedby={hint ? `${id}-hint` : undefined} className="min-h-11 rounded-md border border-cast-line bg-white px-3 text-ink focus:border-temper">
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-cast">
          {hint}
        </p>
      )}
    </div>
  );
}

/** A few related assumptions under a small heading, so the section reads by subject rather than as one grid. */
function AdvancedGroup({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2">
      <legend className="mb-2 text-sm font-bold tracking-wide text-cast uppercase">{title}</legend>
      {children}
    </fieldset>
  );
}

/** Litres or cubic inches, chosen on purpose beside the field: the number typed is read in this unit, never converted. */
function DisplacementUnitControl({ value, registration }: { value: DisplacementUnit; registration: UseFormRegisterReturn }) {
  return (
    <fieldset className="flex shrink-0">
      <legend className="sr-only">Displacement unit</legend>
      <div className="inline-flex items-stretch rounded-md border border-cast-line bg-white p-0.5">
        {DISPLACEMENT_UNITS.map((u) => (
          <label
            key={u}
            className={`relative inline-flex cursor-pointer items-center rounded px-3 text-sm font-semibold whitespace-nowrap has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-temper ${
              value === u ? 'bg-temper text-white' : 'text-ink hover:text-temper'
            }`}
          >
            <input
              type="radio"
              value={u}
              {...registration}
              // Covers the whole label, so a tap anywhere on it lands on the radio itself.
              className="absolute inset-0 m-0 cursor-pointer opacity-0"
            />
            {DISPLACEMENT_UNIT_LABELS[u].short}
            <span className="sr-only"> ({DISPLACEMENT_UNIT_LABELS[u].long})</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export interface FitmentFormProps {
  initialValues: FitmentFormValues;
  system: UnitSystem;
  onSystemChange: (system: UnitSystem) => void;
  onSubmit: (request: FitmentRequest) => void;
  pending: boolean;
  /** Field errors the server answered with, keyed by the API's paths. */
  serverFieldErrors?: Record<string, string[]>;
  /** Called when a submit is refused here, so the page stops showing an answer to earlier values. */
  onRefused?: () => void;
}

export function FitmentForm({ initialValues, system, onSystemChange, onSubmit, pending, serverFieldErrors, onRefused }: FitmentFormProps) {
  const systemRef = useRef(system);
  systemRef.current = system;
  const [resolver] = useState(() => fitmentResolver(systemRef));
  const form = useForm<FitmentFormValues>({
    defaultValues: initialValues,
    resolver,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
    // The error summary takes focus instead, so a screen reader hears every problem at once.
    shouldFocusError: false,
  });
  const { register, formState, getValues, reset, setError, setFocus, trigger, watch } = form;
  const [advancedOpen, setAdvancedOpen] = useState(false);

  const goTo = (field: FormField) => {
    if (ADVANCED_FIELDS.includes(field)) setAdvancedOpen(true);
    requestAnimationFrame(() => setFocus(field));
  };
  const summary = useErrorSummary(form, SUMMARY_FIELDS, { focusField: (id) => goTo(fieldOfId(id)) });
  const summaryCount = summary.props.items.length;
  const errors = formState.errors;

  useEffect(() => {
    if (!serverFieldErrors) return;
    let shown = false;
    for (const [path, messages] of Object.entries(serverFieldErrors)) {
      const field = formFieldOf(path);
      if (!field) continue;
      setError(field, { type: 'server', message: capitalise(messages[0] ?? 'not valid') });
      if (ADVANCED_FIELDS.includes(field)) setAdvancedOpen(true);
      shown = true;
    }
    // The server's refusal is heard like the form's own: the summary takes focus.
    if (shown) summary.showInvalid();
    // Once per answer from the server; the summary's functions are new on each render.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [serverFieldErrors, setError]);

  const switchUnits = (next: UnitSystem) => {
    if (next === system) return;
    const values = getValues();
    reset(requestToForm(formToRequest(values, system) as Partial<FitmentRequest>, next, values));
    onSystemChange(next);
  };

  const submit = summary.handleSubmit(
    (values) => {
      onSubmit(FitmentRequestSchema.parse(formToRequest(values, systemRef.current)));
    },
    (invalid) => {
      if (ADVANCED_FIELDS.some((f) => f in invalid)) setAdvancedOpen(true);
      onRefused?.();
    },
  );

  const fuel = watch('fuel');
  const application = watch('application');
  const intercooled = watch('intercooled');
  const displacementText = watch('displacement');
  const displacementUnit = watch('displacementUnit');
  const peakRpmText = watch('rpm');
  const unit = (f: NumericField) => NUMERIC_FIELDS[f].unit(system);
  const otherDisplacement = displacementSystem(displacementUnit === 'L' ? 'in3' : 'L');
  const typedLitres = formToRequest({ ...getValues(), displacement: displacementText, displacementUnit }, system).displacementL;
  const useLabel = APPLICATION_DEFAULTS[application].label;
  const peakRpm = Number(peakRpmText.replace(/,/g, ''));
  const fullBoostFraction = APPLICATION_DEFAULTS[application].fullBoostFraction;
  const fullBoostHint =
    Number.isFinite(peakRpm) && peakRpm >= 1000
      ? `Default ${show.rpm(Math.round((peakRpm * fullBoostFraction) / 50) * 50)}, ${show.pct(fullBoostFraction)} of peak-power rpm for ${useLabel}. The turbine housing is chosen to get there.`
      : `Default ${show.pct(fullBoostFraction)} of peak-power rpm for ${useLabel}. The turbine housing is chosen to get there.`;

  return (
    <form onSubmit={submit} noValidate aria-labelledby="fitment-form-heading" className="grid gap-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="fitment-form-heading" className="text-xl font-bold">
          Your engine
        </h2>
        <UnitSwitch value={system} onChange={switchUnits} />
      </div>

      {summary.shown && <ErrorSummary title={summaryCount === 1 ? 'One value needs fixing' : `${summaryCount} values need fixing`} {...summary.props} />}

      <div className="grid gap-4 sm:grid-cols-2">
        <div className="sm:col-span-2">
          <Field
            name="displacement"
            label="Engine displacement"
            addon={
              <DisplacementUnitControl
                value={displacementUnit}
                registration={register('displacementUnit', {
                  onChange: (e: { target: { value: string } }) => {
                    const next: DisplacementUnit = e.target.value === 'in3' ? 'in3' : 'L';
                    rememberDisplacementUnit(next);
                    // The number now reads in the other unit; say at once whether it still makes sense.
                    if (formState.isSubmitted) void trigger('displacement');
                  },
                })}
              />
            }
            hint={
              typeof typedLitres === 'number' && Number.isFinite(typedLitres) && typedLitres > 0
                ? `Read as ${show.displacementIn(typedLitres, displacementUnit)} = ${show.displacement(typedLitres, otherDisplacement)}. All cylinders together.`
                : `All cylinders together, in ${DISPLACEMENT_UNIT_LABELS[displacementUnit].long}.`
            }
            error={errors.displacement?.message}
            registration={register('displacement')}
          />
        </div>
        <Field
          name="power"
          label="Power wanted"
          unit={unit('power')}
          hint="At the crank, with the turbo."
          error={errors.power?.message}
          registration={register('power')}
        />
        <Field
          name="rpm"
          label="Peak-power rpm"
          unit="rpm"
          hint="Engine speed where that power comes."
          error={errors.rpm?.message}
          registration={register('rpm')}
        />
        <div className="sm:col-span-2">
          <SelectField name="fuel" label="Fuel" options={FUELS.map((f) => [f, FUEL_LABELS[f]])} registration={register('fuel')} />
        </div>
        <div className="sm:col-span-2">
          <SelectField
            name="application"
            label="Application"
            hint="Circuit and marine run at full load for long spells, so they keep more in hand; drag runs are short."
            options={APPLICATIONS.map((a) => [a, APPLICATION_LABELS[a]])}
            registration={register('application')}
          />
        </div>
      </div>

      <details
        open={advancedOpen}
        onToggle={(e) => setAdvancedOpen(e.currentTarget.open)}
        className="group rounded-md border border-cast-line bg-white"
      >
        <summary className="grid min-h-11 cursor-pointer list-none grid-cols-[auto_1fr] items-center gap-x-2 px-4 py-2 [&::-webkit-details-marker]:hidden">
          <ChevronRight aria-hidden className="size-4 text-temper transition-transform group-open:rotate-90" />
          <span className="font-semibold text-temper">Advanced assumptions</span>
          <span className="col-start-2 text-sm text-cast">For tuners: air, cooling, fuel and injectors, losses, spool. Leave blank for our defaults.</span>
        </summary>
        <div className="grid gap-6 border-t border-cast-line p-4">
          <AdvancedGroup title="Air at the inlet">
            <Field
              name="altitude"
              label="Altitude"
              unit={unit('altitude')}
              hint={`Default sea level (${show.altitude(0, system)}). Thinner air needs a higher pressure ratio.`}
              error={errors.altitude?.message}
              registration={register('altitude')}
            />
            <Field
              name="inletTemp"
              label="Inlet air temperature"
              unit={unit('inletTemp')}
              hint={`At the compressor inlet. Default ${show.temp(DEFAULT_AMBIENT_C, system)}.`}
              error={errors.inletTemp?.message}
              registration={register('inletTemp')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Charge cooling">
            <div className="grid content-start gap-1 sm:col-span-2">
              <label className="flex min-h-11 items-center gap-3 font-semibold">
                <input
                  id={fieldId('intercooled')}
                  type="checkbox"
                  {...register('intercooled')}
                  aria-describedby={`${fieldId('intercooled')}-hint`}
                  className="size-5 accent-temper"
                />
                Intercooled (a charge-air cooler is fitted)
              </label>
              <p id={`${fieldId('intercooled')}-hint`} className="text-sm text-cast">
                Default: yes.
              </p>
            </div>
            <Field
              name="intercoolerEffectiveness"
              label="Intercooler effectiveness"
              unit={unit('intercoolerEffectiveness')}
              hint={
                intercooled
                  ? `Share of the compressor’s heat the cooler takes out. Default ${show.pct(APPLICATION_DEFAULTS[application].intercoolerEffectiveness)} for ${useLabel}.`
                  : 'Not used without an intercooler.'
              }
              error={errors.intercoolerEffectiveness?.message}
              registration={register('intercoolerEffectiveness')}
            />
            <Field
              name="manifoldTemp"
              label="Manifold air temperature"
              unit={unit('manifoldTemp')}
              hint="Leave blank to work it out from the compressor and intercooler."
              error={errors.manifoldTemp?.message}
              registration={register('manifoldTemp')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Fuel and injectors">
            <Field
              name="bsfc"
              label="BSFC (brake-specific fuel consumption)"
              unit={unit('bsfc')}
              hint={`Default ${show.bsfc(defaultBsfcLbPerHpH(fuel, application), system)} for ${FUEL_LABELS[fuel].toLowerCase()}, ${useLabel}.`}
              error={errors.bsfc?.message}
              registration={register('bsfc')}
            />
            <Field
              name="afr"
              label="Air-fuel ratio at full load"
              unit=":1"
              hint={`By mass. Default ${defaultAfr(fuel, application).toFixed(1)}:1 for ${FUEL_LABELS[fuel].toLowerCase()}, ${useLabel}.`}
              error={errors.afr?.message}
              registration={register('afr')}
            />
            <Field
              name="cylinders"
              label="Number of cylinders"
              hint="One injector each: gives the flow every injector must deliver."
              error={errors.cylinders?.message}
              registration={register('cylinders')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Breathing and losses">
            <Field
              name="volumetricEfficiency"
              label="Volumetric efficiency"
              unit="%"
              hint={`Default ${show.pct(DEFAULT_VOLUMETRIC_EFFICIENCY)}, a healthy four-valve head at full load.`}
              error={errors.volumetricEfficiency?.message}
              registration={register('volumetricEfficiency')}
            />
            <Field
              name="compressorEfficiency"
              label="Compressor efficiency"
              unit="%"
              hint={`For the outlet temperature. Default ${show.pct(DEFAULT_COMPRESSOR_EFFICIENCY)}.`}
              error={errors.compressorEfficiency?.message}
              registration={register('compressorEfficiency')}
            />
            <Field
              name="chargeLoss"
              label="Charge-side pressure loss"
              unit={unit('chargeLoss')}
              hint={`Intercooler and pipes. Default ${show.lossPsi(intercooled ? DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED : DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER, system)}.`}
              error={errors.chargeLoss?.message}
              registration={register('chargeLoss')}
            />
            <Field
              name="inletLoss"
              label="Inlet pressure loss"
              unit={unit('inletLoss')}
              hint={`Filter and intake. Default ${show.lossPsi(DEFAULT_INLET_LOSS_PSI, system)}.`}
              error={errors.inletLoss?.message}
              registration={register('inletLoss')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Spool">
            <Field
              name="fullBoostRpm"
              label="Full boost from"
              unit={unit('fullBoostRpm')}
              hint={fullBoostHint}
              error={errors.fullBoostRpm?.message}
              registration={register('fullBoostRpm')}
            />
          </AdvancedGroup>
        </div>
      </details>

      <div>
        <Button type="submit" size="lg" disabled={pending} className="w-full sm:w-auto">
          {pending ? 'Checking…' : 'Check fitment'}
        </Button>
      </div>
    </form>
  );
}
