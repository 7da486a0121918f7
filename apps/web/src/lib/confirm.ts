// An imperative confirm: `await confirmDialog({...})` resolves true or false once the person answers
// in the dialog that <ConfirmHost /> (mounted once in the app) shows.
import { useSyncExternalStore } from 'react';

export interface ConfirmRequest {
  title: string;
  message: string;
  confirmLabel: string;
  cancelLabel?: string;
  tone?: 'primary' | 'danger';
}

interface Pending extends ConfirmRequest {
  resolve: (ok: boolean) => void;
}

let pending: Pending | null = null;
const listeners = new Set<() => void>();
const emit = () => listeners.forEach((l) => l());

export function confirmDialog(request: ConfirmRequest): Promise<boolean> {
  // A second request while one is open answers the first with "no".
  pending?.resolve(false);
  return new Promise((resolve) => {
    pending = {
      ...request,
      resolve: (ok) => {
        pending = null;
        emit();
        resolve(ok);
      },
    };
    emit();
  });
}

export function usePendingConfirm(): Pending | null {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => pending,
  );
}
