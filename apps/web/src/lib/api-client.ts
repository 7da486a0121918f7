import type { ErrorBody, ErrorCode } from '@splitcase/contracts';

/** An error from the API, in the standard shape. `fields` maps input names to messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network',
    message: string,
    readonly fields: Record<string, string> = {},
    readonly details?: unknown,
  ) {
    super(message);
  }
}

type Listener = () => void;
const unauthenticatedListeners = new Set<Listener>();
/** Called whenever a request comes back 401 (the session ended): the app goes to sign-in. */
export function onUnauthenticated(fn: Listener): () => void {
  unauthenticatedListeners.add(fn);
  return () => unauthenticatedListeners.delete(fn);
}

let csrfToken: string | null = null;
let csrfPending: Promise<string> | null = null;

async function getCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  csrfPending ??= fetch('/api/auth/csrf', { credentials: 'same-origin' })
    .then((r) => r.json() as Promise<{ token: string }>)
    .then((b) => (csrfToken = b.token))
    .finally(() => (csrfPending = null));
  return csrfPending;
}

/** Forget the CSRF token (the server starts a new session at sign-in and sign-out). */
export function resetCsrfToken(): void {
  csrfToken = null;
}

async function toApiError(res: Response): Promise<ApiError> {
  let body: ErrorBody | null = null;
  try {
    body = (await res.json()) as ErrorBody;
  } catch {
    /* not JSON */
  }
  const e = body?.error;
  return new ApiError(res.status, e?.code ?? 'internal', e?.message ?? `The server answered ${res.status}.`, e?.fields ?? {}, e?.details);
}

export interface RequestOptions {
  body?: unknown;
  query?: Record<string, string | number | boolean | undefined | null | (string | number)[]>;
  signal?: AbortSignal;
  /** Do not treat 401 as "session ended" (used by the sign-in check itself). */
  quiet401?: boolean;
  /** Send FormData as-is (multipart). */
  form?: FormData;
  /** Return the raw Response (downloads). */
  raw?: boolean;
  /** Extra request headers (e.g. the confirm-unpublish header, see lib/unpublish-confirm.ts). */
  headers?: Record<string, string>;
}

export function buildUrl(path: string, query?: RequestOptions['query']): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query ?? {})) {
    if (v === undefined || v === null || v === '') continue;
    if (Array.isArray(v)) v.forEach((x) => params.append(k, String(x)));
    else params.set(k, String(v));
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

async function request<T>(method: string, path: string, opts: RequestOptions = {}, retried = false): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', ...opts.headers };
  const changing = method !== 'GET';
  if (changing) headers['X-CSRF-Token'] = await getCsrfToken();
  let body: BodyInit | undefined;
  if (opts.form) body = opts.form;
  else if (opts.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(opts.body);
  }
  let res: Response;
  try {
    res = await fetch(buildUrl(path, opts.query), { method, headers, body, credentials: 'same-origin', signal: opts.signal });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    throw new ApiError(0, 'network', 'Cannot reach the server. Check the connection and try again.');
  }
  if (!res.ok) {
    const error = await toApiError(res);
    if (error.code === 'csrf_invalid' && !retried) {
      resetCsrfToken();
      return request<T>(method, path, opts, true);
    }
    if (res.status === 401 && !opts.quiet401) unauthenticatedListeners.forEach((fn) => fn());
    throw error;
  }
  if (opts.raw) return res as unknown as T;
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

/** The one API client of the web app. */
export const api = {
  get: <T>(path: string, opts?: RequestOptions) => request<T>('GET', path, opts),
  post: <T>(path: string, body?: unknown, opts?: RequestOptions) => request<T>('POST', path, { ...opts, body }),
  put: <T>(path: string, body?: unknown, opts?: RequestOptions) => request<T>('PUT', path, { ...opts, body }),
  patch: <T>(path: string, body?: unknown, opts?: RequestOptions) => request<T>('PATCH', path, { ...opts, body }),
  delete: <T>(path: string, opts?: RequestOptions) => request<T>('DELETE', path, opts),
  postForm: <T>(path: string, form: FormData, opts?: RequestOptions) => request<T>('POST', path, { ...opts, form }),
  /**
   * Multipart upload with progress (XMLHttpRequest: fetch has no upload progress).
   * Resolves with the parsed JSON body; rejects with ApiError. `abort` cancels.
   */
  upload<T>(path: string, form: FormData, onProgress: (fraction: number) => void): { promise: Promise<T>; abort: () => void } {
    const xhr = new XMLHttpRequest();
    const promise = getCsrfToken().then(
      (token) =>
        new Promise<T>((resolve, reject) => {
          xhr.open('POST', path);
          xhr.setRequestHeader('X-CSRF-Token', token);
          xhr.setRequestHeader('Accept', 'application/json');
          xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
          xhr.onload = () => {
            let parsed: unknown = null;
            try {
              parsed = JSON.parse(xhr.responseText);
            } catch {
              /* empty */
            }
            if (xhr.status >= 200 && xhr.status < 300) return resolve(parsed as T);
            const e = (parsed as ErrorBody | null)?.error;
            if (xhr.status === 401) unauthenticatedListeners.forEach((fn) => fn());
            if (e?.code === 'csrf_invalid') resetCsrfToken();
            reject(new ApiError(xhr.status, e?.code ?? 'internal', e?.message ?? `Upload failed (${xhr.status}).`, e?.fields ?? {}, e?.details));
          };
          xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload was interrupted. Check the connection and retry.'));
          xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
          xhr.send(form);
        }),
    );
    return { promise, abort: () => xhr.abort() };
  },
};
