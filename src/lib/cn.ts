import { clsx, type ClassValue } from 'clsx';
import { extendTailwindMerge } from 'tailwind-merge';

// tailwind-merge knows Tailwind's own scales; our theme adds one shadow (`shadow-card`), which it would
// otherwise read as a shadow colour and drop beside a `shadow-<colour>` class.
const twMerge = extendTailwindMerge({ extend: { theme: { shadow: ['card'] } } });

/**
 * Joins class names (clsx: strings, falsy values, arrays, `{ class: condition }` objects) and lets a
 * later Tailwind class win over an earlier one of the same kind, so `cn(base, className)` can override.
 */
export function cn(...classes: ClassValue[]): string {
  return twMerge(clsx(classes));
}
