import { useLayoutEffect, useRef, useState, type RefObject } from 'react';
import type { FitmentRequest } from '../../../../shared/schemas/fitment';
import { formToRequest, requestToForm, type FitmentFormValues, type FormField, type UnitSystem } from '../lib/units';
import type { FitmentFormProps } from './fitment-form';
import { FitmentFormView, type Registrar } from './fitment-form-view';

// The form library and the validation library (together a third of a first visit's script) load when someone shows
// they mean to use the form: the pointer comes over it, or it is touched or focused. Until then a stand-in draws the
// very same fields, and what is typed, chosen or submitted there carries over. Loaded once, kept for every visit.
type Form = typeof import('./fitment-form').FitmentForm;
let loadedForm: Form | null = null;
let loadingForm: Promise<Form> | null = null;
function loadForm(): Promise<Form> {
  loadingForm ??= import('./fitment-form').then(
    (m) => (loadedForm = m.FitmentForm),
    (err: unknown) => {
      // A failed load (say, the connection dropped) is tried again on the next sign of intent.
      loadingForm = null;
      throw err;
    },
  );
  return loadingForm;
}

/** What the stand-in holds when the form arrives: its values, and where the visitor was typing. */
interface Handover {
  values: FitmentFormValues;
  focusId: string | null;
  selection: [number, number] | null;
  advancedOpen: boolean;
  submit: boolean;
}

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
  onSubmit,
  formRef,
}: {
  values: FitmentFormValues;
  system: UnitSystem;
  onSwitchUnits: (next: UnitSystem) => void;
  onIntent: () => void;
  onPress: () => void;
  onSubmit: () => void;
  formRef: RefObject<HTMLFormElement | null>;
}) {
  const [advancedOpen, setAdvancedOpen] = useState(false);
  const reg: Registrar = (name, radioValue) =>
    name === 'intercooled'
      ? { name, defaultChecked: values.intercooled }
      : radioValue !== undefined
        ? { name, defaultChecked: values[name] === radioValue }
        : { name, defaultValue: String(values[name]) };
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
      formProps={{ ref: formRef, onPointerEnter: onIntent, onPointerDown: onPress, onFocus: onIntent }}
    />
  );
}

/** The fitment form: at first a stand-in of the same fields, then the real form with what was typed in it. */
export function FitmentFormSlot(props: FitmentFormProps) {
  const [Form, setForm] = useState<Form | null>(() => loadedForm);
  const formRef = useRef<HTMLFormElement>(null);
  // The stand-in's values as last drawn (a unit switch redraws them); what is typed lives in its fields.
  const [standIn, setStandIn] = useState({ key: 0, values: props.initialValues });
  const standInValues = useRef(standIn.values);
  standInValues.current = standIn.values;
  const [handover, setHandover] = useState<Handover | null>(null);
  const submitWanted = useRef(false);
  // A press on the stand-in (a tap on its button, say) ends on the same element it began on, or its click is lost: a
  // form that arrives meanwhile waits until the press, and its click, are over.
  const pressing = useRef(false);
  const waiting = useRef<Form | null>(null);

  const swap = (loaded: Form) => {
    const form = formRef.current;
    const active = document.activeElement;
    const focused = form && (active instanceof HTMLInputElement || active instanceof HTMLSelectElement) && form.contains(active) ? active : null;
    setHandover({
      values: form ? readValues(form, standInValues.current) : standInValues.current,
      focusId: focused?.id || null,
      selection: focused instanceof HTMLInputElement && focused.type === 'text' ? [focused.selectionStart ?? 0, focused.selectionEnd ?? 0] : null,
      advancedOpen: Boolean(form?.querySelector('details')?.open),
      submit: submitWanted.current,
    });
    setForm(() => loaded);
  };
  const arrive = (loaded: Form) => {
    if (pressing.current) waiting.current = loaded;
    else swap(loaded);
  };
  const want = () => {
    if (Form) return;
    loadForm().then(arrive, () => undefined);
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
        if (waiting.current) swap(waiting.current);
        waiting.current = null;
      }, 0);
    };
    window.addEventListener('pointerup', release, true);
    window.addEventListener('pointercancel', release, true);
  };

  // Typing carries on in the same field, at the same place, once the form has taken the stand-in's place.
  useLayoutEffect(() => {
    if (!Form || !handover?.focusId) return;
    const field = document.getElementById(handover.focusId);
    if (!(field instanceof HTMLInputElement || field instanceof HTMLSelectElement)) return;
    field.focus();
    if (handover.selection && field instanceof HTMLInputElement) field.setSelectionRange(...handover.selection);
  }, [Form, handover]);

  if (Form) {
    return (
      <Form
        {...props}
        initialValues={handover?.values ?? props.initialValues}
        initialAdvancedOpen={handover?.advancedOpen ?? false}
        submitOnMount={handover?.submit ?? false}
      />
    );
  }
  return (
    <StandIn
      key={standIn.key}
      values={standIn.values}
      system={props.system}
      formRef={formRef}
      onIntent={want}
      onPress={press}
      onSubmit={() => {
        submitWanted.current = true;
        want();
      }}
      onSwitchUnits={(next) => {
        want();
        if (next === props.system) return;
        const typed = formRef.current ? readValues(formRef.current, standIn.values) : standIn.values;
        setStandIn((s) => ({ key: s.key + 1, values: requestToForm(formToRequest(typed, props.system) as Partial<FitmentRequest>, next, typed) }));
        props.onSystemChange(next);
      }}
    />
  );
}
