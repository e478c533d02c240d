import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

interface ModalProps {
  title: string;
  children: ReactNode;
  /** The buttons, right-aligned under the body. */
  footer: ReactNode;
  onCancel(): void;
  className?: string;
}

/**
 * A modal dialog. The native <dialog> opened with showModal() traps focus, makes the page behind it
 * inert and closes on Escape (which cancels); the title names it and the body describes it.
 */
export function Modal({ title, children, footer, onCancel, className }: ModalProps) {
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
      className={cn('m-auto w-full max-w-lg rounded-lg border border-paper-300 bg-paper-50 p-6 text-ink-900 shadow-card backdrop:bg-ink-950/30', className)}
    >
      <h2 id={titleId} className="text-lg font-bold">{title}</h2>
      <div id={bodyId} className="mt-3 flex flex-col gap-2 text-sm text-ink-800">{children}</div>
      <div className="mt-5 flex flex-wrap justify-end gap-2">{footer}</div>
    </dialog>
  );
}
