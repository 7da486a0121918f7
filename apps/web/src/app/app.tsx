import { useEffect } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router/dom';
import { Toaster } from 'sonner';
import { ConfirmHost } from '@/components/dialog';
import { onUnauthenticated } from '@/lib/api-client';
import { meKey } from '@/lib/session';
import { queryClient } from './query-client';
import { router } from './router';

export function App() {
  // A 401 anywhere means the session ended: forget the user; the guard sends them to sign-in.
  useEffect(() => onUnauthenticated(() => queryClient.setQueryData(meKey, null)), []);
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
      <ConfirmHost />
      <Toaster position="bottom-right" richColors closeButton toastOptions={{ className: 'font-sans' }} />
    </QueryClientProvider>
  );
}
