import { Link, type LinkProps } from 'react-router';
import { cn } from '../../lib/cn';

export function TextLink({ className, ...props }: LinkProps) {
  return (
    <Link
      {...props}
      className={cn('font-semibold text-ink-700 underline decoration-ink-300 underline-offset-2 hover:decoration-ink-700', className)}
    />
  );
}
