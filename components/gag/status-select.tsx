'use client';
import { STATUS_LABELS, type GagStatus, allowedManualMoves } from '@/lib/gags/status';

/** Offers only the moves a person may make by hand; "ready to ink" comes from a stamp. */
export function StatusSelect({
  id,
  status,
  onChange,
  disabled,
  label,
}: {
  id: string;
  status: GagStatus;
  onChange: (next: GagStatus) => void;
  disabled?: boolean;
  label: string;
}) {
  const options: GagStatus[] = [status, ...allowedManualMoves(status)];
  return (
    <select
      id={id}
      aria-label={label}
      value={status}
      disabled={disabled}
      onChange={(e) => onChange(e.target.value as GagStatus)}
      className="field w-auto py-1.5 text-sm"
    >
      {options.map((s) => (
        <option key={s} value={s}>
          {s === status ? `${STATUS_LABELS[s]} (now)` : `Move to ${STATUS_LABELS[s]}`}
        </option>
      ))}
    </select>
  );
}
