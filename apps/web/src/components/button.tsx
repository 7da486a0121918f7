import { forwardRef, type ButtonHTMLAttributes } from 'react';
import { Loader2 } from 'lucide-react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger' | 'quiet';
type Size = 'sm' | 'md' | 'lg';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-copper-600 text-white hover:bg-copper-700 active:bg-copper-800 disabled:bg-copper-200 disabled:text-white',
  secondary: 'bg-white text-graphite-900 ring-1 ring-inset ring-graphite-200 hover:bg-graphite-50 hover:ring-graphite-300 disabled:text-graphite-400',
  ghost: 'text-graphite-700 hover:bg-graphite-100 disabled:text-graphite-300',
  quiet: 'text-copper-700 hover:bg-copper-50 disabled:text-graphite-300',
  danger: 'bg-white text-brick-700 ring-1 ring-inset ring-brick-100 hover:bg-brick-50 disabled:text-graphite-400',
};
const SIZES: Record<Size, string> = {
  sm: 'h-8 px-2.5 text-sm gap-1.5',
  md: 'h-9 px-3.5 text-sm gap-2',
  lg: 'h-11 px-5 text-base gap-2',
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  busy?: boolean;
}

export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant = 'secondary', size = 'md', busy = false, className = '', children, disabled, type = 'button', ...rest },
  ref,
) {
  return (
    <button
      ref={ref}
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex shrink-0 items-center justify-center rounded-md font-medium transition-colors disabled:cursor-not-allowed ${VARIANTS[variant]} ${SIZES[size]} ${className}`}
      {...rest}
    >
      {busy && <Loader2 className="size-4 animate-spin" aria-hidden />}
      {children}
    </button>
  );
});
