import { Suspense } from 'react';
import { NavLink, Outlet, useLocation, useNavigate } from 'react-router';
import { LogOut, BookOpen } from 'lucide-react';
import { ROLE_LABELS } from '@splitcase/contracts';
import { Logo } from '@/components/logo';
import { Spinner } from '@/components/page';
import { WidgetBoundary } from '@/components/error-boundary';
import { navFor } from '@/config/nav';
import { paths } from '@/config/paths';
import { useSignedInUser } from '@/lib/session';
import { useLogout } from '@/features/auth/api/logout';

/** Left rail navigation; the content area is the workspace. */
export function Shell() {
  const me = useSignedInUser();
  const logout = useLogout();
  const navigate = useNavigate();
  const location = useLocation();
  const items = navFor(me.role);
  return (
    <div className="flex min-h-screen">
      <aside className="no-print sticky top-0 flex h-screen w-56 shrink-0 flex-col bg-graphite-950 text-graphite-200">
        <div className="px-4 py-4">
          <Logo inverted />
        </div>
        <nav aria-label="Main" className="flex-1 space-y-0.5 px-2">
          {items.map((item) => {
            const active = item.prefix ? location.pathname.startsWith(item.prefix) : location.pathname === item.to;
            return (
              <NavLink
                key={item.to}
                to={item.to}
                aria-current={active ? 'page' : undefined}
                className={`flex h-9 items-center gap-2.5 rounded-md px-2.5 text-sm font-medium ${active ? 'bg-graphite-800 text-white' : 'text-graphite-300 hover:bg-graphite-900 hover:text-white'}`}
              >
                <item.icon className={`size-4 ${active ? 'text-copper-400' : ''}`} aria-hidden />
                {item.label}
              </NavLink>
            );
          })}
        </nav>
        <div className="space-y-2 border-t border-graphite-800 px-4 py-3 text-sm">
          <a href={paths.api.docs()} className="flex items-center gap-2 text-xs text-graphite-400 hover:text-white">
            <BookOpen className="size-3.5" aria-hidden /> API reference
          </a>
          <NavLink to={paths.account()} className="block rounded-sm hover:text-white" title="Your account and password">
            <div className="truncate font-medium text-white" data-testid="current-user">
              {me.name}
            </div>
            <div className="truncate text-xs text-graphite-400">
              {ROLE_LABELS[me.role]} · {me.email}
            </div>
          </NavLink>
          <button
            type="button"
            onClick={() => logout.mutate(undefined, { onSettled: () => navigate(paths.signIn(), { replace: true }) })}
            className="flex items-center gap-2 text-xs text-graphite-400 hover:text-white"
          >
            <LogOut className="size-3.5" aria-hidden /> Sign out
          </button>
        </div>
      </aside>
      <main className="min-w-0 flex-1 px-8 py-6">
        <WidgetBoundary name="page" key={location.pathname}>
          <Suspense fallback={<Spinner />}>
            <Outlet />
          </Suspense>
        </WidgetBoundary>
      </main>
    </div>
  );
}
