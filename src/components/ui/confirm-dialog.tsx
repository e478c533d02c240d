import type { ReactNode } from 'react';
import { Button } from './button';
import { Modal } from './modal';

interface ConfirmDialogProps {
  title: string;
  children: ReactNode;
  confirmLabel: string;
  pending?: boolean;
  onConfirm(): void;
  onCancel(): void;
}

/** A modal question before something that replaces work: Cancel or the named action. */
export function ConfirmDialog({ title, children, confirmLabel, pending, onConfirm, onCancel }: ConfirmDialogProps) {
  return (
    <Modal
      title={title}
      onCancel={onCancel}
      footer={<>
        <Button variant="secondary" onClick={onCancel}>Cancel</Button>
        <Button pending={pending} onClick={onConfirm}>{confirmLabel}</Button>
      </>}
    >
      {children}
    </Modal>
  );
}
