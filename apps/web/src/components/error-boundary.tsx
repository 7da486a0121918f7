import { Component, type ErrorInfo, type ReactNode } from 'react';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { TriangleAlert } from 'lucide-react';
import { ApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';

function describe(error: unknown): { title: string; message: string } {
  if (error instanceof ApiError) {
    if (error.status === 404) return { title: 'Not found', message: error.message };
    if (error.status === 403) return { title: 'Not allowed', message: error.message };
    return { title: 'The server could not answer', message: error.message };
  }
  if (isRouteErrorResponse(error)) return { title: error.status === 404 ? 'Page not found' : `Error ${error.status}`, message: error.statusText || 'This page does not exist.' };
  return { title: 'Something broke on this page', message: error instanceof Error ? error.message : 'Unknown error.' };
}

export function ErrorPanel({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const { title, message } = describe(error);
  return (
    <div role="alert" className="flex gap-3 rounded-lg border border-brick-100 bg-brick-50 p-4 text-sm text-brick-800">
      <TriangleAlert className="mt-0.5 size-5 shrink-0" aria-hidden />
      <div className="space-y-2">
        <p className="font-semibold">{title}</p>
        <p>{message}</p>
        {onRetry && (
          <button type="button" className="font-medium text-copper-700 underline" onClick={onRetry}>
            Try again
          </button>
        )}
      </div>
    </div>
  );
}

/** Route-level error element (React Router). */
export function RouteError() {
  const error = useRouteError();
  return (
    <div className="mx-auto max-w-xl p-8">
      <ErrorPanel error={error} />
      <p className="mt-4 text-sm">
        <Link className="text-copper-700 underline" to={paths.home()}>
          Back to the home page
        </Link>
      </p>
    </div>
  );
}

/** Widget-level boundary: one broken panel does not take the page down. */
export class WidgetBoundary extends Component<{ children: ReactNode; name?: string }, { error: unknown }> {
  override state: { error: unknown } = { error: null };
  static getDerivedStateFromError(error: unknown) {
    return { error };
  }
  override componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error(`Panel ${this.props.name ?? ''} failed`, error, info.componentStack);
  }
  override render() {
    if (this.state.error) return <ErrorPanel error={this.state.error} onRetry={() => this.setState({ error: null })} />;
    return this.props.children;
  }
}
