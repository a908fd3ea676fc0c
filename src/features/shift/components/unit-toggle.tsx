/** Two or three large radio buttons (48 px high) for a unit: one touch, in gloves. */
export function UnitToggle<T extends string>({ legend, name, options, value, onChange }: {
  legend: string;
  name: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
}) {
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 block text-sm font-medium text-ink-soft">{legend}</legend>
      <div className="flex rounded-lg border border-ink/25 bg-paper-sunk p-0.5">
        {options.map((o) => (
          <label
            key={o.value}
            className={`relative flex min-h-12 min-w-16 flex-1 cursor-pointer items-center justify-center rounded-md px-3 text-lg font-semibold has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-tide ${
              o.value === value ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-raised'
            }`}
          >
            <input type="radio" className="absolute inset-0 h-full w-full cursor-pointer opacity-0" name={name} value={o.value} checked={o.value === value} onChange={() => onChange(o.value)} />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
