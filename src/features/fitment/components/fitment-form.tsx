import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef, useState } from 'react';
import { useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import { FitmentRequestSchema, type DisplacementUnit, type FitmentRequest, type FitmentRequestInput } from '../../../../shared/schemas/fitment';
import { useErrorSummary, type SummaryField } from '../../../components/ui/error-summary';
import { ErrorSummary } from '../../../components/ui/form';
import { rememberDisplacementUnit } from '../lib/displacement-unit';
import { ADVANCED_FIELDS, formFieldOf, formToRequest, NUMERIC_FIELDS, rangeMessage, requestToForm, systemFor, type FitmentFormValues, type FormField, type NumericField, type UnitSystem } from '../lib/units';
import { fieldId, fieldOfId, FitmentFormView, type Registrar } from './fitment-form-view';

export { APPLICATION_LABELS, FUEL_LABELS } from './fitment-form-view';
export { formValuesFor } from '../lib/form-values';

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
  /** Whether the advanced assumptions start open (the visitor opened them in the stand-in). */
  initialAdvancedOpen?: boolean;
  /** Submit at once: the visitor submitted the stand-in before this form arrived. */
  submitOnMount?: boolean;
}

export function FitmentForm({ initialValues, system, onSystemChange, onSubmit, pending, serverFieldErrors, onRefused, initialAdvancedOpen = false, submitOnMount }: FitmentFormProps) {
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
  const [advancedOpen, setAdvancedOpen] = useState(initialAdvancedOpen);

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

  useEffect(() => {
    if (submitOnMount) void submit();
    // Once, as the form takes the stand-in's place.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const reg: Registrar = (name) =>
    name === 'displacementUnit'
      ? register('displacementUnit', {
          onChange: (e: { target: { value: string } }) => {
            const next: DisplacementUnit = e.target.value === 'in3' ? 'in3' : 'L';
            rememberDisplacementUnit(next);
            // The number now reads in the other unit; say at once whether it still makes sense.
            if (formState.isSubmitted) void trigger('displacement');
          },
        })
      : register(name);
  const messages: Partial<Record<FormField, string>> = {};
  for (const [name, error] of Object.entries(errors)) if (typeof error?.message === 'string') messages[name as FormField] = error.message;

  return (
    <FitmentFormView
      values={watch()}
      system={system}
      onSwitchUnits={switchUnits}
      reg={reg}
      errors={messages}
      summary={summary.shown && <ErrorSummary title={summaryCount === 1 ? 'One value needs fixing' : `${summaryCount} values need fixing`} {...summary.props} />}
      advancedOpen={advancedOpen}
      onAdvancedToggle={setAdvancedOpen}
      pending={pending}
      onSubmit={submit}
    />
  );
}
