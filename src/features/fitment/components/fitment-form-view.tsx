import { ChevronRight } from 'lucide-react';
import type { FormEventHandler, FormHTMLAttributes, ReactNode, Ref } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
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
import { APPLICATIONS, DISPLACEMENT_UNITS, FUELS, type Application, type DisplacementUnit, type Fuel } from '../../../../shared/fitment/limits';
import { Button } from '../../../components/ui/button';
import { DISPLACEMENT_UNIT_LABELS } from '../lib/displacement-unit';
import { displacementSystem, formToRequest, NUMERIC_FIELDS, show, type FitmentFormValues, type FormField, type NumericField, type UnitSystem } from '../lib/units';
import { UnitSwitch } from './unit-switch';

/**
 * The fitment form's fields and words, without the form library or the validation library: the real form
 * (fitment-form.tsx) draws them with its registrations, and a stand-in (fitment-form-slot.tsx) draws the very same
 * fields on a first visit until the visitor reaches for the form.
 */

export const FUEL_LABELS: Record<Fuel, string> = { petrol: 'Petrol (gasoline)', e85: 'E85', methanol: 'Methanol', diesel: 'Diesel' };
export const APPLICATION_LABELS: Record<Application, string> = {
  street: 'Street',
  circuit: 'Circuit (track days, racing)',
  drag: 'Drag racing',
  offroad: 'Off-road',
  marine: 'Marine',
};

export const fieldId = (name: FormField) => `fitment-${name}`;
export const fieldOfId = (id: string) => id.replace(/^fitment-/, '') as FormField;

/** What a field's input takes from the form: the form library's registration, or the stand-in's (its first value). */
export type Registered = Partial<UseFormRegisterReturn> & { name: string };
/** A field's registration; for the displacement unit's radios, the one for `radioValue`. */
export type Registrar = (name: FormField, radioValue?: string) => Registered;

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
  registration: Registered;
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
  registration: Registered;
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
function DisplacementUnitControl({ value, registration }: { value: DisplacementUnit; registration: (unit: DisplacementUnit) => Registered }) {
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
              {...registration(u)}
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

export interface FitmentFormViewProps {
  /** The values the hints are worked out from. */
  values: FitmentFormValues;
  system: UnitSystem;
  onSwitchUnits: (next: UnitSystem) => void;
  reg: Registrar;
  errors: Partial<Record<FormField, string>>;
  /** The error summary, when it shows. */
  summary?: ReactNode;
  advancedOpen: boolean;
  onAdvancedToggle: (open: boolean) => void;
  pending: boolean;
  onSubmit: FormEventHandler<HTMLFormElement>;
  formProps?: FormHTMLAttributes<HTMLFormElement> & { ref?: Ref<HTMLFormElement> };
}

export function FitmentFormView({ values, system, onSwitchUnits, reg, errors, summary, advancedOpen, onAdvancedToggle, pending, onSubmit, formProps }: FitmentFormViewProps) {
  const { fuel, application, intercooled, displacementUnit, rpm: peakRpmText } = values;
  const unit = (f: NumericField) => NUMERIC_FIELDS[f].unit(system);
  const otherDisplacement = displacementSystem(displacementUnit === 'L' ? 'in3' : 'L');
  const typedLitres = formToRequest(values, system).displacementL;
  const useLabel = APPLICATION_DEFAULTS[application].label;
  const peakRpm = Number(peakRpmText.replace(/,/g, ''));
  const fullBoostFraction = APPLICATION_DEFAULTS[application].fullBoostFraction;
  const fullBoostHint =
    Number.isFinite(peakRpm) && peakRpm >= 1000
      ? `Default ${show.rpm(Math.round((peakRpm * fullBoostFraction) / 50) * 50)}, ${show.pct(fullBoostFraction)} of peak-power rpm for ${useLabel}. The turbine housing is chosen to get there.`
      : `Default ${show.pct(fullBoostFraction)} of peak-power rpm for ${useLabel}. The turbine housing is chosen to get there.`;

  return (
    <form {...formProps} onSubmit={onSubmit} noValidate aria-labelledby="fitment-form-heading" className="grid gap-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="fitment-form-heading" className="text-xl font-bold">
          Your engine
        </h2>
        <UnitSwitch value={system} onChange={onSwitchUnits} />
      </div>

      {summary}

      <div className="grid gap-4 sm:grid-cols-2">
        <div className="sm:col-span-2">
          <Field
            name="displacement"
            label="Engine displacement"
            addon={
              <DisplacementUnitControl
                value={displacementUnit}
                registration={(u) => reg('displacementUnit', u)}
              />
            }
            hint={
              typeof typedLitres === 'number' && Number.isFinite(typedLitres) && typedLitres > 0
                ? `Read as ${show.displacementIn(typedLitres, displacementUnit)} = ${show.displacement(typedLitres, otherDisplacement)}. All cylinders together.`
                : `All cylinders together, in ${DISPLACEMENT_UNIT_LABELS[displacementUnit].long}.`
            }
            error={errors.displacement}
            registration={reg('displacement')}
          />
        </div>
        <Field
          name="power"
          label="Power wanted"
          unit={unit('power')}
          hint="At the crank, with the turbo."
          error={errors.power}
          registration={reg('power')}
        />
        <Field
          name="rpm"
          label="Peak-power rpm"
          unit="rpm"
          hint="Engine speed where that power comes."
          error={errors.rpm}
          registration={reg('rpm')}
        />
        <div className="sm:col-span-2">
          <SelectField name="fuel" label="Fuel" options={FUELS.map((f) => [f, FUEL_LABELS[f]])} registration={reg('fuel')} />
        </div>
        <div className="sm:col-span-2">
          <SelectField
            name="application"
            label="Application"
            hint="Circuit and marine run at full load for long spells, so they keep more in hand; drag runs are short."
            options={APPLICATIONS.map((a) => [a, APPLICATION_LABELS[a]])}
            registration={reg('application')}
          />
        </div>
      </div>

      <details
        open={advancedOpen}
        onToggle={(e) => onAdvancedToggle(e.currentTarget.open)}
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
              error={errors.altitude}
              registration={reg('altitude')}
            />
            <Field
              name="inletTemp"
              label="Inlet air temperature"
              unit={unit('inletTemp')}
              hint={`At the compressor inlet. Default ${show.temp(DEFAULT_AMBIENT_C, system)}.`}
              error={errors.inletTemp}
              registration={reg('inletTemp')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Charge cooling">
            <div className="grid content-start gap-1 sm:col-span-2">
              <label className="flex min-h-11 items-center gap-3 font-semibold">
                <input
                  id={fieldId('intercooled')}
                  type="checkbox"
                  {...reg('intercooled')}
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
              error={errors.intercoolerEffectiveness}
              registration={reg('intercoolerEffectiveness')}
            />
            <Field
              name="manifoldTemp"
              label="Manifold air temperature"
              unit={unit('manifoldTemp')}
              hint="Leave blank to work it out from the compressor and intercooler."
              error={errors.manifoldTemp}
              registration={reg('manifoldTemp')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Fuel and injectors">
            <Field
              name="bsfc"
              label="BSFC (brake-specific fuel consumption)"
              unit={unit('bsfc')}
              hint={`Default ${show.bsfc(defaultBsfcLbPerHpH(fuel, application), system)} for ${FUEL_LABELS[fuel].toLowerCase()}, ${useLabel}.`}
              error={errors.bsfc}
              registration={reg('bsfc')}
            />
            <Field
              name="afr"
              label="Air-fuel ratio at full load"
              unit=":1"
              hint={`By mass. Default ${defaultAfr(fuel, application).toFixed(1)}:1 for ${FUEL_LABELS[fuel].toLowerCase()}, ${useLabel}.`}
              error={errors.afr}
              registration={reg('afr')}
            />
            <Field
              name="cylinders"
              label="Number of cylinders"
              hint="One injector each: gives the flow every injector must deliver."
              error={errors.cylinders}
              registration={reg('cylinders')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Breathing and losses">
            <Field
              name="volumetricEfficiency"
              label="Volumetric efficiency"
              unit="%"
              hint={`Default ${show.pct(DEFAULT_VOLUMETRIC_EFFICIENCY)}, a healthy four-valve head at full load.`}
              error={errors.volumetricEfficiency}
              registration={reg('volumetricEfficiency')}
            />
            <Field
              name="compressorEfficiency"
              label="Compressor efficiency"
              unit="%"
              hint={`For the outlet temperature. Default ${show.pct(DEFAULT_COMPRESSOR_EFFICIENCY)}.`}
              error={errors.compressorEfficiency}
              registration={reg('compressorEfficiency')}
            />
            <Field
              name="chargeLoss"
              label="Charge-side pressure loss"
              unit={unit('chargeLoss')}
              hint={`Intercooler and pipes. Default ${show.lossPsi(intercooled ? DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED : DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER, system)}.`}
              error={errors.chargeLoss}
              registration={reg('chargeLoss')}
            />
            <Field
              name="inletLoss"
              label="Inlet pressure loss"
              unit={unit('inletLoss')}
              hint={`Filter and intake. Default ${show.lossPsi(DEFAULT_INLET_LOSS_PSI, system)}.`}
              error={errors.inletLoss}
              registration={reg('inletLoss')}
            />
          </AdvancedGroup>
          <AdvancedGroup title="Spool">
            <Field
              name="fullBoostRpm"
              label="Full boost from"
              unit={unit('fullBoostRpm')}
              hint={fullBoostHint}
              error={errors.fullBoostRpm}
              registration={reg('fullBoostRpm')}
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
