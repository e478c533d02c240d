import { useEffect, useState } from 'react';
import type { Progress } from '../../../shared/references';

/** A labelled progress bar; with `startedAt`, an estimate of the time left from the rate so far. */
export function ProgressBar({ progress, label, startedAt }: { progress: Progress; label: string; startedAt?: string | null }) {
  const fraction = progress.total > 0 ? progress.done / progress.total : 0;
  // The clock ticks once a second while an estimate is shown.
  const [now, setNow] = useState(() => Date.now());
  const estimating = !!startedAt && fraction > 0 && fraction < 1;
  useEffect(() => {
    if (!estimating) return;
    const timer = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(timer);
  }, [estimating]);
  let left = '';
  if (estimating) {
    const elapsed = (now - new Date(startedAt!).getTime()) / 1000;
    const seconds = Math.max(0, Math.round((elapsed / fraction) * (1 - fraction)));
    left = seconds >= 60 ? ` · about ${Math.round(seconds / 60)} min left` : ` · about ${seconds} s left`;
  }
  return (
    <div className="flex items-center gap-2 text-xs text-ink-600">
      <progress className="h-2 w-32 accent-ink-600" max={1} value={fraction} aria-label={label} />
      <span>
        {progress.total > 0 ? `${progress.done} / ${progress.total}` : 'waiting'}
        {left}
      </span>
    </div>
  );
}
