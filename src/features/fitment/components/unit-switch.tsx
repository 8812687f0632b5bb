import type { UnitSystem } from '../lib/units';

const OPTIONS: Array<{ value: UnitSystem; label: string; example: string }> = [
  { value: 'metric', label: 'Metric', example: 'L, kW, °C, kg/s' },
  { value: 'imperial', label: 'Imperial', example: 'cu in, hp, °F, lb/min' },
];

/** Metric or imperial: changes the units shown; the check itself always runs in the API's units. */
export function UnitSwitch({ value, onChange }: { value: UnitSystem; onChange: (value: UnitSystem) => void }) {
  return (
    <fieldset className="flex items-center gap-2">
      <legend className="sr-only">Units</legend>
      <span aria-hidden className="text-sm font-semibold text-cast">
        Units
      </span>
      <div className="inline-flex rounded-md border border-cast-line bg-white p-0.5">
        {OPTIONS.map((o) => (
          <label
            key={o.value}
            title={o.example}
            className={`relative inline-flex min-h-10 cursor-pointer items-center rounded px-3 text-sm font-semibold has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-temper ${
              value === o.value ? 'bg-temper text-white' : 'text-ink hover:text-temper'
            }`}
          >
            <input
              type="radio"
              name="fitment-units"
              value={o.value}
              checked={value === o.value}
              onChange={() => onChange(o.value)}
              // Covers the whole label, so a click or tap anywhere on it lands on the radio itself.
              className="absolute inset-0 m-0 cursor-pointer opacity-0"
            />
            {o.label}
            <span className="sr-only"> ({o.example})</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
