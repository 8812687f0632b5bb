import { Minus, Plus } from 'lucide-react';
import { useEffect, useState } from 'react';
import { QUANTITY_MAX } from '../../../../shared/order-limits';
import { readQuantity, stepQuantity } from '../lib/cart-lines';

/** − / number / + with the typed value committed on blur or Enter, so each keystroke is not a request. */
export function QuantityStepper({
  id,
  label,
  value,
  onChange,
  disabled,
}: {
  id: string;
  label: string;
  value: number;
  onChange: (quantity: number) => void;
  disabled?: boolean;
}) {
  const [text, setText] = useState(String(value));
  useEffect(() => setText(String(value)), [value]);
  const commit = () => {
    const n = readQuantity(text);
    if (n === null) setText(String(value));
    else if (n !== value) onChange(n);
  };
  const step = (delta: number) => {
    const n = stepQuantity(value, delta);
    if (n !== value) onChange(n);
  };
  const buttonClass =
    'inline-flex size-10 items-center justify-center border border-cast-line bg-white text-ink hover:border-temper hover:text-temper disabled:cursor-not-allowed disabled:text-cast/60';
  return (
    <div role="group" aria-label={label} className="inline-flex items-stretch">
      <button type="button" className={`${buttonClass} rounded-l-md`} aria-label={`One fewer (${label})`} onClick={() => step(-1)} disabled={disabled || value <= 1}>
        <Minus aria-hidden className="size-4" />
      </button>
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <input
        id={id}
        inputMode="numeric"
        pattern="[0-9]*"
        value={text}
        disabled={disabled}
        onChange={(e) => setText(e.target.value.replace(/[^\d]/g, '').slice(0, 3))}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === 'Enter') {
            e.preventDefault();
            commit();
          }
        }}
        className="tabular h-10 w-14 border-y border-cast-line bg-white text-center"
      />
      <button type="button" className={`${buttonClass} rounded-r-md`} aria-label={`One more (${label})`} onClick={() => step(1)} disabled={disabled || value >= QUANTITY_MAX}>
        <Plus aria-hidden className="size-4" />
      </button>
    </div>
  );
}
