import { type ReactNode, useEffect, useRef } from 'react';
import { Button } from './button';

interface Props {
  open: boolean;
  title: string;
  children?: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  danger?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * Asks before something that is hard to undo. A native modal dialog: focus moves into it and
 * stays there, Escape cancels, and focus returns to where it was when it closes.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  cancelLabel = 'Cancel',
  danger,
  onConfirm,
  onCancel,
}: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby="sf-confirm-title"
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
      className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-card border border-line bg-raised p-5 text-text shadow-xl backdrop:bg-black/50"
    >
      <h2 id="sf-confirm-title" className="text-lead font-bold">
        {title}
      </h2>
      {children ? <div className="mt-2 text-body text-muted">{children}</div> : null}
      <div className="mt-4 flex flex-wrap justify-end gap-2">
        <Button variant="quiet" onClick={onCancel} autoFocus>
          {cancelLabel}
        </Button>
        <Button variant={danger ? 'danger' : 'primary'} onClick={onConfirm}>
          {confirmLabel}
        </Button>
      </div>
    </dialog>
  );
}
