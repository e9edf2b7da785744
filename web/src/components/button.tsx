import { LoaderCircle, type LucideIcon } from 'lucide-react';
import type { ButtonHTMLAttributes } from 'react';
import { classNames } from '../lib/class-names';

const VARIANTS = {
  primary: 'bg-accent text-white hover:bg-accent-strong disabled:bg-accent/50',
  secondary:
    'border border-canvas-line bg-canvas-raised text-ink hover:bg-canvas-sunk disabled:text-ink-faint',
  ghost: 'text-ink hover:bg-canvas-sunk disabled:text-ink-faint',
  danger: 'bg-state-bad text-white hover:bg-state-bad/90 disabled:bg-state-bad/50',
} as const;

const SIZES = { sm: 'h-8 px-2.5 text-sm gap-1.5', md: 'h-10 px-4 text-sm gap-2' } as const;

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: keyof typeof VARIANTS;
  size?: keyof typeof SIZES;
  /** Decorative: the button's text is its label. For icon-only buttons pass `aria-label` and `title`. */
  icon?: LucideIcon;
  isBusy?: boolean;
}

export function Button({
  variant = 'secondary',
  size = 'md',
  icon: Icon,
  isBusy = false,
  className,
  children,
  disabled,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || isBusy}
      aria-busy={isBusy || undefined}
      className={classNames(
        'inline-flex shrink-0 items-center justify-center rounded-md font-bold transition-colors disabled:cursor-not-allowed',
        VARIANTS[variant],
        SIZES[size],
        className,
      )}
      {...rest}
    >
      {isBusy ? (
        <LoaderCircle aria-hidden className="size-4 animate-spin" />
      ) : (
        Icon && <Icon aria-hidden className="size-4" />
      )}
      {children}
    </button>
  );
}
