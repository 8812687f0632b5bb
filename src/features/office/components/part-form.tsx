import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, get, useForm, useWatch, type Control, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { BEARINGS, CATEGORIES, trimPct } from '../../../../shared/catalog';
import { PartFormSchema, type PartForm } from '../../../../shared/schemas/admin-catalog';
import type { AdminPart } from '../../../../shared/schemas/office-views';
import { Button } from '../../../components/ui/button';
import { useSavePart } from '../api/save-part';
import { moneyFieldCents, moneyFieldText } from '../lib/money';
import { gramsToKilogramsText, kilogramsFieldGrams } from '../lib/weight';
import { ALL_SPEC_KEYS, SPEC_FIELDS, specFieldId, specFieldsFor, type SpecField } from '../lib/spec-fields';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextAreaField, TextField } from '../../../components/ui/form';

type FormInput = z.input<typeof PartFormSchema>;

/** Messages for a number field that holds no number at all (zod's own would say "expected number, received NaN"). */
const NOT_A_NUMBER: Partial<Record<string, string>> = {
  priceCents: 'enter the price in dollars, such as 123.45',
  coreDepositCents: 'enter the core deposit in dollars, such as 250.00',
  weightGrams: 'enter the shipping weight in kilograms, such as 9.2',
  minStock: 'enter the minimum stock as a whole number',
};

const baseResolver = zodResolver(PartFormSchema);

/**
 * The shared schema decides. First a new part's deposit is set to 0, and specs the category does not show are
 * kept as stored while the category stays the same (older rows carry a few extra) and cleared when it changes.
 */
function makeResolver(original: AdminPart | undefined): Resolver<FormInput, unknown, PartForm> {
  return async (values, context, options) => {
    const shown = new Set(specFieldsFor(values.category).map((f) => f.key));
    const keepHidden = original !== undefined && original.category === values.category;
    const specs = Object.fromEntries(
      ALL_SPEC_KEYS.map((k) => [k, shown.has(k) ? (values.specs[k] ?? null) : keepHidden ? (original.specs[k] ?? null) : null]),
    ) as FormInput['specs'];
    const prepared: FormInput = { ...values, coreDepositCents: values.condition === 'new' ? 0 : values.coreDepositCents, specs };
    const result = await baseResolver(prepared, context, options);
    for (const [name, message] of Object.entries(NOT_A_NUMBER)) {
      const err = (result.errors as Record<string, { type?: string; message?: string } | undefined>)[name];
      // Only when nothing numeric was typed: a fractional cent is also "invalid_type" in zod 4 and keeps its own message.
      const value = (prepared as Record<string, unknown>)[name];
      if (err && message && (typeof value !== 'number' || Number.isNaN(value))) err.message = message;
    }
    return result;
  };
}

/** Specs stored on the part that its category's form does not show, so nobody wonders where they went. */
function HiddenSpecs({ part, category }: { part: AdminPart | undefined; category: string | undefined }) {
  if (!part || part.category !== category) return null;
  const shown = new Set(specFieldsFor(category).map((f) => f.key));
  const extra = ALL_SPEC_KEYS.filter((k) => !shown.has(k) && part.specs[k] !== null && part.specs[k] !== undefined);
  if (extra.length === 0) return null;
  return (
    <p className="text-sm text-cast md:col-span-2">
      Also stored and kept as they are: {extra.map((k) => `${SPEC_FIELDS[k].label.toLowerCase()} ${String(part.specs[k])}${SPEC_FIELDS[k].unit ? ` ${SPEC_FIELDS[k].unit}` : ''}`).join(', ')}.
    </p>
  );
}

const TOP_FIELDS: Array<{ name: string; id: string; label: string }> = [
  { name: 'partNumber', id: 'part-partNumber', label: 'Part number' },
  { name: 'title', id: 'part-title', label: 'Title' },
  { name: 'category', id: 'part-category', label: 'Category' },
  { name: 'frameCode', id: 'part-frameCode', label: 'Frame code' },
  { name: 'condition', id: 'part-condition', label: 'Condition' },
  { name: 'status', id: 'part-status', label: 'Status' },
  { name: 'priceCents', id: 'part-priceCents', label: 'Price' },
  { name: 'coreDepositCents', id: 'part-coreDepositCents', label: 'Core deposit' },
  { name: 'weightGrams', id: 'part-weightGrams', label: 'Shipping weight' },
  { name: 'minStock', id: 'part-minStock', label: 'Minimum stock' },
];
const SUMMARY_FIELDS = [
  ...TOP_FIELDS,
  ...ALL_SPEC_KEYS.map((k) => ({ name: `specs.${k}`, id: specFieldId(k), label: SPEC_FIELDS[k].label })),
  { name: 'description', id: 'part-description', label: 'Description' },
];

export function toFormValues(part: AdminPart | undefined): FormInput {
  if (!part) {
    return {
      partNumber: '',
      title: '',
      category: undefined as unknown as FormInput['category'],
      frameCode: null,
      condition: 'new',
      status: 'active',
      priceCents: Number.NaN,
      coreDepositCents: 0,
      weightGrams: Number.NaN,
      minStock: 2,
      description: '',
      specs: Object.fromEntries(ALL_SPEC_KEYS.map((k) => [k, null])),
    };
  }
  return {
    partNumber: part.partNumber,
    title: part.title,
    category: part.category,
    frameCode: part.frameCode,
    condition: part.condition,
    // A superseded part is still sold until stock runs out; supersession itself is set below the form.
    status: part.status === 'discontinued' ? 'discontinued' : 'active',
    priceCents: part.priceCents,
    coreDepositCents: part.coreDepositCents,
    weightGrams: part.weightGrams,
    minStock: part.minStock,
    description: part.description,
    specs: Object.fromEntries(ALL_SPEC_KEYS.map((k) => [k, part.specs[k] ?? null])),
  };
}

const nullIfBlank = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : v);
const numberOrNull = (v: unknown) => {
  if (v === null || v === undefined) return null;
  const s = String(v).trim().replace(',', '.');
  return s === '' ? null : Number(s);
};

/** A whole-unit value typed in a bigger unit: dollars for cents, kilograms for grams. */
/** How a scaled box reads and writes its value: dollars for cents, kilograms for grams. */
interface Scale {
  toValue: (text: string) => number;
  toText: (value: number) => string;
}
const DOLLARS: Scale = { toValue: moneyFieldCents, toText: moneyFieldText };
const KILOGRAMS: Scale = { toValue: kilogramsFieldGrams, toText: gramsToKilogramsText };

function ScaledInput({ control, name, id, label, hint, scale, prefix, suffix, error }: {
  control: Control<FormInput, unknown, PartForm>;
  name: 'priceCents' | 'coreDepositCents' | 'weightGrams';
  id: string;
  label: string;
  hint?: string;
  scale: Scale;
  prefix?: string;
  suffix?: string;
  error?: string;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => <ScaledInputField field={field} id={id} label={label} hint={hint} scale={scale} prefix={prefix} suffix={suffix} error={error} />}
    />
  );
}

function ScaledInputField({ field, scale, ...rest }: {
  field: { value: number; onChange: (v: number) => void; onBlur: () => void; ref: (el: HTMLInputElement | null) => void; name: string };
  id: string;
  label: string;
  hint?: string;
  scale: Scale;
  prefix?: string;
  suffix?: string;
  error?: string;
}) {
  const [text, setText] = useState(() => scale.toText(field.value));
  return (
    <TextField
      {...rest}
      ref={field.ref}
      name={field.name}
      inputMode="decimal"
      autoComplete="off"
      value={text}
      onChange={(e) => {
        setText(e.target.value);
        field.onChange(scale.toValue(e.target.value));
      }}
      onBlur={field.onBlur}
    />
  );
}

function SpecInput({ spec, form }: { spec: SpecField; form: ReturnType<typeof useForm<FormInput, unknown, PartForm>> }) {
  const id = specFieldId(spec.key);
  const name = `specs.${spec.key}` as const;
  const error = (get(form.formState.errors, name) as { message?: string } | undefined)?.message;
  if (spec.kind === 'bearing') {
    return (
      <SelectField id={id} label={spec.label} error={error} optional {...form.register(name, { setValueAs: nullIfBlank })}>
        <option value="">Not set</option>
        {BEARINGS.map((b) => (
          <option key={b} value={b}>
            {b === 'ball' ? 'Ball bearing' : 'Journal bearing'}
          </option>
        ))}
      </SelectField>
    );
  }
  return (
    <TextField
      id={id}
      label={spec.label}
      hint={spec.key === 'trimPct' ? <TrimHint form={form} base={spec.hint} /> : spec.hint}
      error={error}
      optional
      suffix={spec.unit}
      placeholder={spec.placeholder}
      inputMode={spec.kind === 'number' ? 'decimal' : undefined}
      autoComplete="off"
      {...form.register(name, { setValueAs: spec.kind === 'number' ? numberOrNull : nullIfBlank })}
    />
  );
}

/** The trim the wheel sizes give, offered beside the typed one so a slip shows. */
function TrimHint({ form, base }: { form: ReturnType<typeof useForm<FormInput, unknown, PartForm>>; base?: string }) {
  const [inducer, exducer, typed] = useWatch({ control: form.control, name: ['specs.inducerMm', 'specs.exducerMm', 'specs.trimPct'] });
  const ind = numberOrNull(inducer);
  const exd = numberOrNull(exducer);
  const computed = typeof ind === 'number' && typeof exd === 'number' && ind > 0 && exd > ind ? trimPct(ind, exd) : null;
  const typedNumber = numberOrNull(typed);
  return (
    <>
      {base}{' '}
      {computed !== null ? (
        <span className="inline-flex flex-wrap items-center gap-2">
          <span>
            From the wheel sizes: <strong className="tabular text-ink">{computed}</strong>
            {typeof typedNumber === 'number' && Math.abs(typedNumber - computed) > 0.5 ? ' — differs from the trim entered.' : typedNumber === computed ? ', matches.' : '.'}
          </span>
          {typedNumber !== computed && (
            <button
              type="button"
              className="font-semibold text-temper underline underline-offset-2"
              onClick={() => form.setValue('specs.trimPct', computed, { shouldDirty: true, shouldValidate: form.formState.isSubmitted })}
            >
              Use {computed}
            </button>
          )}
        </span>
      ) : (
        'Enter inducer and exducer to see the trim they give.'
      )}
    </>
  );
}

export function PartFormView({ part, onSaved }: { part?: AdminPart; onSaved: (partNumber: string, created: boolean) => void }) {
  const [resolver] = useState(() => makeResolver(part));
  const form = useForm<FormInput, unknown, PartForm>({ resolver, defaultValues: toFormValues(part) });
  const save = useSavePart(part?.partNumber);
  const summary = useErrorSummary(form, SUMMARY_FIELDS);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const errors = form.formState.errors;
  const [category, condition] = useWatch({ control: form.control, name: ['category', 'condition'] });
  const specs = specFieldsFor(category);

  const onSubmit = summary.handleSubmit(
    (values) => {
      setSavedAt(null);
      save.mutate(values, {
        onSuccess: (r) => {
          setSavedAt(new Date().toLocaleTimeString('en-US', { hour: 'numeric', minute: '2-digit' }));
          form.reset(values);
          onSaved(r.partNumber, !part);
        },
        onError: (err) => summary.showServerError(err),
      });
    },
    () => save.reset(),
  );

  const fieldError = (name: string) => (get(errors, name) as { message?: string } | undefined)?.message;

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-6" aria-label={part ? `Edit ${part.partNumber}` : 'New part'}>
      {summary.shown && <ErrorSummary {...summary.props} />}
      {savedAt && !form.formState.isDirty && (
        <p role="status" className="rounded-md border border-machined bg-machined-tint p-3 font-semibold text-machined">
          ✓ Saved at {savedAt}.
        </p>
      )}

      <fieldset className="grid gap-4 rounded-lg bg-white p-5 ring-1 ring-cast-line md:grid-cols-2">
        <legend className="px-1 text-lg font-bold">Part</legend>
        <TextField
          id="part-partNumber"
          label="Part number"
          hint={part ? 'The part number cannot change: supersede the part by a new one instead.' : 'Frame code, category group and line, serial, e.g. CHS-50-0901; add -XCH for an exchange unit.'}
          error={fieldError('partNumber')}
          readOnly={Boolean(part)}
          autoComplete="off"
          className={`part-no uppercase ${part ? 'bg-panel' : ''}`}
          {...form.register('partNumber')}
        />
        {part && (
          <TextField
            id="part-gtin"
            label="GTIN"
            hint="Given by the shop when the part was added (our numbers for internal use); it never changes and prints on the part's labels."
            readOnly
            autoComplete="off"
            className="tabular bg-panel"
            value={part.gtin}
          />
        )}
        <TextField id="part-title" label="Title" error={fieldError('title')} autoComplete="off" {...form.register('title')} />
        <SelectField id="part-category" label="Category" hint="Decides which specification fields apply." error={fieldError('category')} {...form.register('category')}>
          <option value="">Choose a category</option>
          {CATEGORIES.map((c) => (
            <option key={c.slug} value={c.slug}>
              {c.label}
            </option>
          ))}
        </SelectField>
        <TextField
          id="part-frameCode"
          label="Frame code"
          optional
          hint="The Vanecraft frame it belongs to, e.g. CHS. Leave empty for universal parts."
          error={fieldError('frameCode')}
          autoComplete="off"
          className="uppercase"
          {...form.register('frameCode', { setValueAs: (v: unknown) => (typeof v === 'string' ? (v.trim() === '' ? null : v.trim().toUpperCase()) : v) })}
        />
        <SelectField id="part-condition" label="Condition" hint="An exchange unit carries a core deposit, refunded when the old unit comes back." error={fieldError('condition')} {...form.register('condition')}>
          <option value="new">New</option>
          <option value="exchange">Remanufactured, on exchange</option>
        </SelectField>
        <SelectField id="part-status" label="Status" error={fieldError('status')} {...form.register('status')}>
          <option value="active">Active</option>
          <option value="discontinued">Discontinued</option>
        </SelectField>
      </fieldset>

      <fieldset className="grid gap-4 rounded-lg bg-white p-5 ring-1 ring-cast-line md:grid-cols-2">
        <legend className="px-1 text-lg font-bold">Price and stock</legend>
        <ScaledInput
          control={form.control}
          name="priceCents"
          id="part-priceCents"
          label="Price"
          hint="Retail price in dollars, before tax; dealers get their tier discount off it."
          scale={DOLLARS}
          prefix="$"
          error={fieldError('priceCents')}
        />
        {condition === 'exchange' && (
          <ScaledInput
            control={form.control}
            name="coreDepositCents"
            id="part-coreDepositCents"
            label="Core deposit"
            hint="Charged with the unit and refunded after the old core is inspected."
            scale={DOLLARS}
            prefix="$"
            error={fieldError('coreDepositCents')}
          />
        )}
        <ScaledInput
          control={form.control}
          name="weightGrams"
          id="part-weightGrams"
          label="Shipping weight"
          hint="Packed weight, used for freight."
          scale={KILOGRAMS}
          suffix="kg"
          error={fieldError('weightGrams')}
        />
        <TextField
          id="part-minStock"
          label="Minimum stock"
          hint="Below this the part shows on the warehouse's low-stock list."
          error={fieldError('minStock')}
          inputMode="numeric"
          autoComplete="off"
          suffix="units"
          {...form.register('minStock', { setValueAs: (v: unknown) => (String(v).trim() === '' ? Number.NaN : Number(v)) })}
        />
      </fieldset>

      <fieldset className="grid gap-4 rounded-lg bg-white p-5 ring-1 ring-cast-line md:grid-cols-2">
        <legend className="px-1 text-lg font-bold">Specification</legend>
        {specs.length === 0 ? (
          <p className="text-cast md:col-span-2">Choose a category to see the specification fields that apply to it.</p>
        ) : (
          specs.map((s) => <SpecInput key={s.key} spec={s} form={form} />)
        )}
        <HiddenSpecs part={part} category={category} />
      </fieldset>

      <TextAreaField id="part-description" label="Description" rows={4} error={fieldError('description')} hint="Plain words for the buyer: what it is, what it fits, what comes in the box." {...form.register('description')} />

      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" size="lg" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : part ? 'Save changes' : 'Create part'}
        </Button>
        {form.formState.isDirty && <p className="text-cast">Unsaved changes.</p>}
      </div>
    </form>
  );
}
