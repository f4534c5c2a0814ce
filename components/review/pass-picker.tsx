'use client';
// Chooses one of a gag's passes by number (the review section and the compare view).

export function PassPicker({
  label,
  passes,
  value,
  onChange,
}: {
  label: string;
  passes: { id: string; number: number }[];
  value: string;
  onChange: (id: string) => void;
}) {
  return (
    <label className="text-sm font-bold text-graphite-soft">
      {label}
      <select className="field mt-1 w-auto py-1.5" value={value} onChange={(e) => onChange(e.target.value)}>
        {passes.map((p) => (
          <option key={p.id} value={p.id}>
            Pass {p.number}
          </option>
        ))}
      </select>
    </label>
  );
}
