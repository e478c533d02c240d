import type { ButtonHTMLAttributes, Ref } from 'react';
import { cn } from '../../lib/cn';

const variants = {
  primary: 'bg-ink-700 text-paper-50 hover:bg-ink-800 active:bg-ink-900 disabled:bg-ink-400',
  secondary: 'border border-ink-300 bg-paper-50 text-ink-800 hover:bg-ink-50 disabled:text-ink-400',
  ghost: 'text-ink-700 hover:bg-ink-50 disabled:text-ink-300',
  danger: 'border border-alert-600/40 bg-paper-50 text-alert-700 hover:bg-alert-50 disabled:text-alert-600/50',
} as const;

const sizes = {
  sm: 'px-2.5 py-1 text-sm',
  md: 'px-4 py-2 text-sm',
} as const;

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  ref?: Ref<HTMLButtonElement>;
  variant?: keyof typeof variants;
  size?: keyof typeof sizes;
  /** While true the button is disabled and says `pendingText` instead. */
  pending?: boolean;
  pendingText?: string;
}

export function Button({
  variant = 'primary',
  size = 'md',
  pending = false,
  pendingText,
  disabled,
  className,
  children,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={cn(
        'inline-flex items-center justify-center gap-2 rounded-md font-semibold transition-colors disabled:cursor-not-allowed',
        variants[variant],
        sizes[size],
        className,
      )}
      {...rest}
    >
      {pending && (
        <span aria-hidden="true" className="size-3 animate-spin rounded-full border-2 border-current border-t-transparent" />
      )}
      {pending && pendingText ? pendingText : children}
    </button>
  );
}
