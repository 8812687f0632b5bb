import { clockWords, VIEWED_FROM, type FrameClocking, type Orientation } from '../../../../shared/exploded-view';

export interface OrientationChoice {
  clocking: FrameClocking;
  value: Orientation;
  onChange: (value: Orientation) => void;
}

/** A complete unit's housing positions, as clock positions; the frame's standard position is chosen until changed. */
export function OrientationPicker({ clocking, value, onChange, disabled }: OrientationChoice & { disabled?: boolean }) {
  const { standard } = clocking;
  const field = (key: keyof Orientation, label: string, offered: readonly Orientation[keyof Orientation][]) => (
    <div className="grid gap-1">
      <label htmlFor={`orientation-${key}`} className="text-sm font-semibold">
        {label}
      </label>
      <select
        id={`orientation-${key}`}
        value={value[key]}
        disabled={disabled}
        aria-describedby="orientation-hint"
        onChange={(e) => onChange({ ...value, [key]: offered.find((p) => p === e.target.value) ?? standard[key] })}
        className="min-h-11 rounded-md border border-cast bg-white px-2"
      >
        {offered.map((p) => (
          <option key={p} value={p}>
            {clockWords(p)}
            {p === standard[key] ? ' (standard)' : ''}
          </option>
        ))}
      </select>
    </div>
  );
  const isStandard = value.compressorOutlet === standard.compressorOutlet && value.turbineInlet === standard.turbineInlet;
  return (
    <fieldset className="grid gap-2">
      <legend className="text-sm font-semibold">Housing positions</legend>
      <div className="flex flex-wrap gap-3">
        {field('compressorOutlet', 'Compressor outlet', clocking.compressorOutlet)}
        {field('turbineInlet', 'Turbine inlet', clocking.turbineInlet)}
      </div>
      <p id="orientation-hint" className="text-sm text-cast">
        Clock positions {VIEWED_FROM}.{' '}
        {isStandard
          ? `This is the frame's standard position (compressor outlet ${clockWords(standard.compressorOutlet)}, turbine inlet ${clockWords(standard.turbineInlet)}): change it only if your installation needs it.`
          : `We build the unit in this position instead of the standard one (compressor outlet ${clockWords(standard.compressorOutlet)}, turbine inlet ${clockWords(standard.turbineInlet)}).`}
      </p>
    </fieldset>
  );
}
