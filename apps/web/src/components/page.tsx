import type { ReactNode } from 'react';

export function PageHeader({ title, subtitle, actions, eyebrow }: { title: ReactNode; subtitle?: ReactNode; actions?: ReactNode; eyebrow?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div className="min-w-0">
        {eyebrow && <div className="mb-1 text-xs font-medium uppercase tracking-wider text-graphite-600">{eyebrow}</div>}
        <h1 className="text-2xl font-semibold tracking-tight text-graphite-950">{title}</h1>
        {subtitle && <p className="mt-1 max-w-3xl text-sm text-graphite-600">{subtitle}</p>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}

export function Card({ children, className = '', title, actions }: { children: ReactNode; className?: string; title?: ReactNode; actions?: ReactNode }) {
  return (
    <section className={`rounded-lg border border-graphite-150 bg-white shadow-card ${className}`}>
      {(title || actions) && (
        <div className="flex items-center justify-between gap-3 border-b border-graphite-100 px-4 py-3">
          <h2 className="text-sm font-semibold text-graphite-900">{title}</h2>
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}

/** One sentence saying what to do next, and the one action. */
export function EmptyState({ icon, message, action }: { icon?: ReactNode; message: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-3 px-6 py-10 text-center">
      {icon && <div className="text-graphite-300">{icon}</div>}
      <p className="max-w-md text-sm text-graphite-600">{message}</p>
      {action}
    </div>
  );
}

export function Spinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex items-center gap-2 p-6 text-sm text-graphite-500" role="status">
      <span className="size-4 animate-spin rounded-full border-2 border-graphite-200 border-t-copper-500" aria-hidden />
      {label}
    </div>
  );
}
