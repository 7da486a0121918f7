import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router';
import type { Role } from '@splitcase/contracts';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useMe } from '@/lib/session';

/** Signed-in users only; others go to sign-in and come back afterwards. */
export function RequireAuth({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Spinner label="Opening the workspace…" />;
  if (me.isError)
    return (
      <div className="p-8">
        <ErrorPanel error={me.error} onRetry={() => me.refetch()} />
      </div>
    );
  if (!me.data) return <Navigate to={paths.signIn(location.pathname + location.search)} replace />;
  return <>{children}</>;
}

/** Pages for some roles only (the server enforces the same rule on every route). */
export function RequireRole({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const me = useMe().data;
  if (!me) return null;
  if (!roles.includes(me.role)) {
    return (
      <div className="max-w-xl">
        <ErrorPanel error={new Error('Your role does not give access to this page. Ask an admin if you need it.')} />
      </div>
    );
  }
  return <>{children}</>;
}

/** Pages for signed-out visitors (sign-in…): a signed-in user goes home. */
export function AnonymousOnly({ children }: { children: ReactNode }) {
  const me = useMe();
  if (me.isPending) return <Spinner />;
  if (me.data) return <Navigate to={paths.home()} replace />;
  return <>{children}</>;
}
