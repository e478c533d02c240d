/** A placeholder while data loads; the label is read out by screen readers. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-6 text-sm text-ink-600">
      <span aria-hidden="true" className="size-4 animate-spin rounded-full border-2 border-ink-300 border-t-ink-700" />
      {label}
    </div>
  );
}
