// A labelled form field with its error message tied to the input for screen readers.
export function Field({ id, label, error, hint, children }: { id: string; label: string; error?: string; hint?: string; children: React.ReactNode }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-bold text-graphite-soft">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-xs text-graphite-faint">{hint}</p>}
      {error && (
        <p id={`${id}-error`} role="alert" className="text-sm text-stamp">
          {error}
        </p>
      )}
    </div>
  );
}
