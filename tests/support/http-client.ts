// A signed-in client over real HTTP (for a listening server or a child server process): a cookie
// jar, the CSRF header, and a streamed multipart upload that can stop as soon as the server answers.
import { request as httpRequest } from 'node:http';

export interface HttpSession {
  base: string;
  cookie: string;
  csrf: string;
  json(method: string, path: string, body?: unknown): Promise<{ status: number; body: unknown }>;
}

function mergeCookies(jar: Map<string, string>, res: Response) {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(';');
    const eq = pair!.indexOf('=');
    jar.set(pair!.slice(0, eq), pair!.slice(eq + 1));
  }
}

/** Signs in with e-mail and password; the session keeps its cookie and CSRF token. */
export async function signIn(base: string, email: string, password: string): Promise<HttpSession> {
  const jar = new Map<string, string>();
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const call = async (method: string, path: string, body?: unknown, csrf?: string) => {
    const res = await fetch(base + path, {
      method,
      headers: { cookie: cookie(), ...(csrf ? { 'x-csrf-token': csrf } : {}), ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    mergeCookies(jar, res);
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      // not JSON
    }
    return { status: res.status, body: parsed };
  };
  let csrf = ((await call('GET', '/api/auth/csrf')).body as { token: string }).token;
  const login = await call('POST', '/api/auth/login', { email, password }, csrf);
  if (login.status !== 200) throw new Error(`Sign-in of ${email} failed: ${login.status} ${JSON.stringify(login.body)}`);
  csrf = ((await call('GET', '/api/auth/csrf')).body as { token: string }).token;
  const session: HttpSession = {
    base,
    get cookie() {
      return cookie();
    },
    csrf,
    json: (method, path, body) => call(method, path, body, method === 'GET' ? undefined : session.csrf),
  };
  return session;
}

export interface StreamedUpload {
  status: number;
  body: unknown;
  /** Bytes of the body written before the answer arrived (or all of them). */
  sentBeforeAnswer: number;
  /** Whether the whole body was written. */
  complete: boolean;
}

/**
 * POSTs a multipart body streamed from a reused 1 MiB buffer: `head` (the parts before the file and
 * the file part's headers), then `fileBytes` of filler, then the closing boundary. With `chunked`
 * the request has no Content-Length. Stops writing as soon as the server answers, so a size limit
 * that refuses early costs neither side the whole body; nothing of it is ever held in memory.
 */
export function streamUpload(
  session: HttpSession,
  path: string,
  opts: { boundary: string; head: string; fileBytes: number; chunked?: boolean; extraHeaders?: Record<string, string> },
): Promise<StreamedUpload> {
  const url = new URL(path, session.base);
  const tail = Buffer.from(`\r\n--${opts.boundary}--\r\n`);
  const head = Buffer.from(opts.head);
  const total = head.length + opts.fileBytes + tail.length;
  const filler = Buffer.alloc(1024 * 1024, 0x41);
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered = false;
    let complete = false;
    const req = httpRequest(
      {
        method: 'POST',
        host: url.hostname,
        port: url.port,
        path: url.pathname + url.search,
        headers: {
          cookie: session.cookie,
          'x-csrf-token': session.csrf,
          'content-type': `multipart/form-data; boundary=${opts.boundary}`,
          ...(opts.chunked ? { 'transfer-encoding': 'chunked' } : { 'content-length': String(total) }),
          ...opts.extraHeaders,
        },
      },
      (res) => {
        answered = true;
        const sentBeforeAnswer = sent;
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          const text = Buffer.concat(chunks).toString('utf8');
          let body: unknown = text;
          try {
            body = JSON.parse(text);
          } catch {
            // not JSON
          }
          req.destroy();
          resolve({ status: res.statusCode ?? 0, body, sentBeforeAnswer, complete });
        });
      },
    );
    req.on('error', (err) => {
      if (!answered) reject(err);
    });
    const write = (buf: Buffer) => {
      sent += buf.length;
      return req.write(buf);
    };
    (async () => {
      write(head);
      let left = opts.fileBytes;
      while (left > 0 && !answered && !req.destroyed) {
        const piece = left >= filler.length ? filler : filler.subarray(0, left);
        left -= piece.length;
        if (!write(piece)) {
          await new Promise<void>((r) => {
            const go = () => {
              req.off('drain', go).off('close', go);
              r();
            };
            req.on('drain', go).on('close', go);
          });
        }
      }
      if (!answered && !req.destroyed) {
        write(tail);
        complete = true;
        req.end();
      }
    })().catch(reject);
  });
}
