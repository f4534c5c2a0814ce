import { forwardRef } from 'react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger' | 'stamp';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-ink text-white hover:bg-ink-hover disabled:bg-marker-60',
  secondary: 'border border-paper-edge bg-white text-graphite hover:bg-paper-deep disabled:text-graphite-faint',
  ghost: 'text-graphite-soft hover:bg-paper-deep hover:text-graphite',
  danger: 'bg-stamp text-white hover:bg-stamp/90',
  /** The editor's "ready to ink" stamp: its own colour, never the one for deleting. */
  stamp: 'bg-ready text-white hover:bg-ready/90 disabled:opacity-60',
};

export type ButtonProps = React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant };

export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant = 'primary', className = '', type = 'button', ...props },
  ref,
) {
  return (
    <button
      ref={ref}
      type={type}
      className={`inline-flex items-center justify-center gap-1.5 rounded-md px-3 py-2 text-sm font-bold transition-colors disabled:cursor-not-allowed ${VARIANTS[variant]} ${className}`}
      {...props}
    />
  );
});
