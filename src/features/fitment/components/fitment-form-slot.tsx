import { useLayoutEffect, useRef, useState, type RefObject } from 'react';
import type { FitmentRequest } from '../../../../shared/schemas/fitment';
import { formToRequest, requestToForm, type FitmentFormValues, type FormField, type UnitSystem } from '../lib/units';
import type { FitmentFormProps } from './fitment-form';
import { loadOnIntent } from '../../../lib/load-on-intent';
import { FitmentFormView, type Registrar } from './fitment-form-view';

// The form library and the validation library (together a third of a first visit's script) load when someone shows
// they mean to use the form: the pointer comes over it, or it is touched or focused. Until then a stand-in draws the
// very same fields, and what is typed, chosen or submitted there carries over. Loaded once, kept for every visit.
type Form = typeof import('./fitment-form').FitmentForm;
const form = loadOnIntent(() => import('./fitment-form').then((m) => m.FitmentForm));

function readValues(form: HTMLFormElement, base: FitmentFormValues): FitmentFormValues {
  const values: Record<string, unknown> = { ...base };
  for (const name of Object.keys(base) as FormField[]) {
    const item = form.elements.namedItem(name);
    if (item instanceof HTMLInputElement && item.type === 'checkbox') values[name] = item.checked;
    else if (item instanceof HTMLInputElement || item instanceof HTMLSelectElement || item instanceof RadioNodeList) values[name] = item.value;
  }
  return values as unknown as FitmentFormValues;
}

function StandIn({
  values,
  system,
  onSwitchUnits,
  onIntent,
  onPress,
  onLeave,
  onEdit,
  onSubmit,
  formRef,
}: {
  values: FitmentFormValues;
  system: UnitSystem;
  onSwitchUnits: (next: UnitSystem) => void;
  onIntent: () => void;
  onPress: () => void;
  onLeave: () => void;
  onEdit: () => void;
  onSubmit: () => void;
  formRef: RefObject<HTMLFormElement | null>;
}) {
  const [advancedOpen, setAdvancedOpen] = useState(false);
  // The first values go in as the form library puts them (through each field's element, not as attributes), so the
  // stand-in's fields are the form's to the pixel; after that, what is typed stays the visitor's.
  const reg: Registrar = (name, radioValue) => ({
    name,
    ref: (el: HTMLInputElement | HTMLSelectElement | null) => {
      if (!el || filled.has(el)) return;
      filled.add(el);
      if (el instanceof HTMLInputElement && el.type === 'checkbox') el.checked = Boolean(values[name]);
      else if (el instanceof HTMLInputElement && el.type === 'radio') el.checked = values[name] === radioValue;
      else el.value = String(values[name]);
    },
  });
  return (
    <FitmentFormView
      values={values}
      system={system}
      onSwitchUnits={onSwitchUnits}
      reg={reg}
      errors={{}}
      advancedOpen={advancedOpen}
      onAdvancedToggle={setAdvancedOpen}
      pending={false}
      onSubmit={(e) => {
        e.preventDefault();
        onSubmit();
      }}
      formProps={{ ref: formRef, onPointerEnter: onIntent, onPointerDown: onPress, onFocus: onIntent, onBlur: onLeave, onChange: onEdit }}
    />
  );
}

const filled = new WeakSet<Element>();

/** Writes values into the stand-in's fields (a unit switch converts what was typed), without drawing them again. */
function writeValues(form: HTMLFormElement, values: FitmentFormValues) {
  for (const [name, value] of Object.entries(values)) {
    const item = form.elements.namedItem(name);
    if (item instanceof HTMLInputElement && item.type === 'checkbox') item.checked = Boolean(value);
    else if (item instanceof HTMLInputElement || item instanceof HTMLSelectElement || item instanceof RadioNodeList) item.value = String(value);
  }
}

const FOCUSABLE = 'input, select, button, summary, a[href]';
/** Where focus is inside a form, as a place among its focusable elements (the same in the stand-in and the form). */
const focusPlace = (form: HTMLFormElement | null) =>
  form && document.activeElement ? Array.from(form.querySelectorAll(FOCUSABLE)).indexOf(document.activeElement) : -1;

/** Whether the visitor is typing or choosing in one of the stand-in's fields. */
function inField(form: HTMLFormElement | null) {
  const active = document.activeElement;
  return Boolean(form && (active instanceof HTMLInputElement || active instanceof HTMLSelectElement) && form.contains(active));
}

/**
 * The fitment form: at first a stand-in of the same fields, then the real form with what was typed in it. The form
 * takes the stand-in's place only between two moves of the visitor (not while a field has focus or a press is under
 * way), so nothing typed or clicked lands in a field that has just gone; a submit of the stand-in brings it at once.
 */
export function FitmentFormSlot(props: FitmentFormProps) {
  const [Form, setForm] = useState<Form | null>(() => form.loaded());
  const formRef = useRef<HTMLFormElement>(null);
  // The values the stand-in's hints read; what is typed lives in its fields.
  const [standInValues, setStandInValues] = useState(props.initialValues);
  const [handover, setHandover] = useState<{ values: FitmentFormValues; advancedOpen: boolean; submit: boolean; focus: number } | null>(null);
  const swapped = useRef(false);
  const pressing = useRef(false);
  const arrived = useRef<Form | null>(null);
  // The stand-in was submitted before the form arrived: the form submits as it comes.
  const submitWanted = useRef(false);

  const swap = (submit: boolean) => {
    const loaded = arrived.current;
    const form = formRef.current;
    if (!loaded || swapped.current) return;
    swapped.current = true;
    setHandover({
      values: form ? readValues(form, standInValues) : standInValues,
      advancedOpen: Boolean(form?.querySelector('details')?.open),
      submit,
      focus: focusPlace(form),
    });
    setForm(() => loaded);
  };
  // A keyboard user on the stand-in's button, radio or fold keeps their place in the form.
  const slotRef = useRef<HTMLDivElement>(null);
  useLayoutEffect(() => {
    if (!Form || !handover || handover.focus < 0 || handover.submit) return;
    const form = slotRef.current?.querySelector('form');
    const target = form?.querySelectorAll<HTMLElement>(FOCUSABLE)[handover.focus];
    target?.focus();
  }, [Form, handover]);
  // Between two moves: no press under way, no field in use.
  const swapWhenIdle = () => {
    if (!pressing.current && !inField(formRef.current)) swap(false);
  };
  const want = () => {
    if (Form) return;
    form.load().then(
      (loaded) => {
        arrived.current = loaded;
        if (submitWanted.current) swap(true);
        else swapWhenIdle();
      },
      () => undefined,
    );
  };
  const press = () => {
    want();
    pressing.current = true;
    const release = () => {
      window.removeEventListener('pointerup', release, true);
      window.removeEventListener('pointercancel', release, true);
      // After the click that follows the release.
      setTimeout(() => {
        pressing.current = false;
        swapWhenIdle();
      }, 0);
    };
    window.addEventListener('pointerup', release, true);
    window.addEventListener('pointercancel', release, true);
  };

  return (
    // `display: contents`: a handle to find the form by, with no box of its own.
    <div ref={slotRef} className="contents">
      {Form ? (
        <Form
          {...props}
          initialValues={handover?.values ?? props.initialValues}
          initialAdvancedOpen={handover?.advancedOpen ?? false}
          submitOnMount={handover?.submit ?? false}
        />
      ) : (
        <StandIn
          values={standInValues}
          system={props.system}
          formRef={formRef}
          onIntent={want}
          onPress={press}
          // Leaving a field: the form may come in now, once focus has settled on what comes next.
          onLeave={() => setTimeout(swapWhenIdle, 0)}
          // The hints follow what is typed, as the form's own do.
          onEdit={() => formRef.current && setStandInValues(readValues(formRef.current, standInValues))}
          onSubmit={() => {
            want();
            if (arrived.current) swap(true);
            else submitWanted.current = true;
          }}
          onSwitchUnits={(next) => {
            want();
            if (next === props.system || !formRef.current) return;
            const typed = readValues(formRef.current, standInValues);
            const converted = requestToForm(formToRequest(typed, props.system) as Partial<FitmentRequest>, next, typed);
            writeValues(formRef.current, converted);
            setStandInValues(converted);
            props.onSystemChange(next);
          }}
        />
      )}
    </div>
  );
}
