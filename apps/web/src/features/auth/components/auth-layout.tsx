import type { ReactNode } from 'react';
import { Logo } from '@/components/logo';

export function AuthLayout({ title, children, footer }: { title: string; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="grid min-h-screen lg:grid-cols-[1fr_minmax(420px,520px)]">
      <div className="relative hidden overflow-hidden bg-graphite-950 p-12 text-paper lg:flex lg:flex-col lg:justify-between">
        <Logo inverted />
        <div className="max-w-md space-y-4">
          <p className="text-3xl font-semibold leading-tight tracking-tight">Open it up. Measure it. Know what it costs.</p>
          <p className="text-graphite-300">
            Teardown notes, power figures, should-cost and side-by-side comparisons of battery-powered devices, in one workspace for the bench, sourcing and product leads.
          </p>
        </div>
        <svg className="absolute -right-24 bottom-10 w-[420px] text-graphite-800" viewBox="0 0 32 32" aria-hidden>
          <path d="M5 8.5A3.5 3.5 0 0 1 8.5 5H19.2L10 27H8.5A3.5 3.5 0 0 1 5 23.5Z" fill="none" stroke="currentColor" strokeWidth="0.3" />
          <path d="M27 23.5a3.5 3.5 0 0 1-3.5 3.5H12.8L22 5h1.5A3.5 3.5 0 0 1 27 8.5Z" fill="none" stroke="currentColor" strokeWidth="0.3" />
        </svg>
        <p className="text-xs text-graphite-500">Figures are engineering estimates, not certification results.</p>
      </div>
      <main className="flex items-center justify-center px-6 py-12">
        <div className="w-full max-w-sm">
          <div className="mb-8 lg:hidden">
            <Logo />
          </div>
          <h1 className="mb-6 text-2xl font-semibold tracking-tight">{title}</h1>
          {children}
          {footer && <div className="mt-6 text-sm text-graphite-600">{footer}</div>}
        </div>
      </main>
    </div>
  );
}
