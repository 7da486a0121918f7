import { useEffect, useRef, type ReactNode } from 'react';
import { X } from 'lucide-react';
import { usePendingConfirm } from '@/lib/confirm';
import { Button } from './button';

/** A modal dialog on the native <dialog> element (focus trap, Escape closes). */
export function Dialog({ open, onClose, title, children, footer, wide = false }: { open: boolean; onClose: () => void; title: ReactNode; children: ReactNode; footer?: ReactNode; wide?: boolean }) {
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
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      aria-labelledby="dialog-title"
      className={`m-auto w-[calc(100%-2rem)] ${wide ? 'max-w-3xl' : 'max-w-lg'} rounded-lg border border-graphite-150 bg-white p-0 text-graphite-950 shadow-xl backdrop:bg-graphite-950/40`}
    >
      {open && (
        <div>
          <div className="flex items-start justify-between gap-3 border-b border-graphite-100 px-5 py-3.5">
            <h2 id="dialog-title" className="text-base font-semibold">
              {title}
            </h2>
            <button type="button" onClick={onClose} aria-label="Close" className="rounded p-1 text-graphite-500 hover:bg-graphite-100">
              <X className="size-4" aria-hidden />
            </button>
          </div>
          <div className="px-5 py-4 text-sm">{children}</div>
          {footer && <div className="flex flex-wrap justify-end gap-2 border-t border-graphite-100 px-5 py-3">{footer}</div>}
        </div>
      )}
    </dialog>
  );
}

/** Shows the pending confirmDialog() request; mounted once in the app. */
export function ConfirmHost() {
  const pending = usePendingConfirm();
  return (
    <Dialog
      open={Boolean(pending)}
      onClose={() => pending?.resolve(false)}
      title={pending?.title ?? ''}
      footer={
        pending && (
          <>
            <Button onClick={() => pending.resolve(false)}>{pending.cancelLabel ?? 'Cancel'}</Button>
            <Button variant={pending.tone === 'danger' ? 'danger' : 'primary'} onClick={() => pending.resolve(true)} autoFocus>
              {pending.confirmLabel}
            </Button>
          </>
        )
      }
    >
      <p className="text-graphite-700">{pending?.message}</p>
    </Dialog>
  );
}
