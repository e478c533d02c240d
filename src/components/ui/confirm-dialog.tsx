import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';

interface ConfirmDialogProps {
  title: string;
  children: ReactNode;
  confirmLabel: string;
  pending?: boolean;
  onConfirm(): void;
  onCancel(): void;
}

/**
 * A modal question before something that replaces work. The native <dialog> opened with showModal()
 * traps focus, makes the page behind it inert and closes on Escape (which cancels).
 */
export function ConfirmDialog({ title, children, confirmLabel, pending, onConfirm, onCancel }: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(e) => (e.preventDefault(), onCancel())}
      className="m-auto w-full max-w-lg rounded-lg border border-paper-300 bg-paper-50 p-6 text-ink-900 shadow-card backdrop:bg-ink-950/30"
    >
      <h2 id={titleId} className="text-lg font-bold">{title}</h2>
      <div id={bodyId} className="mt-3 flex flex-col gap-2 text-sm text-ink-800">{children}</div>
      <div className="mt-5 flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>Cancel</Button>
        <Button pending={pending} onClick={onConfirm}>{confirmLabel}</Button>
      </div>
    </dialog>
  );
}
