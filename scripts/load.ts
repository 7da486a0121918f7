// `npm run load`: a bounded load test on loopback only. Starts the API in a child process on
// 127.0.0.1 over a throwaway copy of the demo workspace, signs in ten sessions across the roles,
// and drives it with autocannon: 50 connections (each keeps one session) cycling through reads
// (home, a teardown, its figures and cost, search, a run's chart series, lineups) and writes (a
// comment; a reading added and removed again on a draft) for 60 s, or 10 minutes with --soak.
// Reports errors, latency p50/p95/p99, and the server's memory over time: resident memory (RSS, from
// /proc, Linux) every second, and the V8 heap in use right after a full garbage collection every
// 10 s (scripts/load-server.ts answers over IPC). Passes when there are no errors, no non-2xx
// answers, and no memory growth trend: a least-squares line through the heap-after-GC samples
// rises by less than 5 % of their mean over the measured run (retained memory, which is what a
// leak grows; RSS saws with collection and is reported only). The same load runs first for a
// warm-up (60 s, not measured) so caches and the heap reach their working size. Exit code 1
// otherwise. Not part of `npm test`.
//   --soak            10 minutes measured instead of 60 s
//   --duration <s>    any other length
//   --warm-up <s>     instead of 60 (0: none)
//   --connections <n> instead of 50
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';

const args = process.argv.slice(2);
const option = (name: string) => {
  const k = args.indexOf(name);
  return k >= 0 ? args[k + 1] : undefined;
};
const DURATION_S = Number(option('--duration') ?? (args.includes('--soak') ? 600 : 60));
const CONNECTIONS = Number(option('--connections') ?? 50);
const WARM_UP_S = Number(option('--warm-up') ?? 60);
const GROWTH_LIMIT = 0.05;
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const PASSWORD = 'load-test-password';

// ---- the server, in a child process on loopback -------------------------------------------------
const dataDir = mkdtempSync(join(tmpdir(), 'splitcase-load-'));
const server = spawn(process.execPath, ['--expose-gc', '--import', 'tsx', join(root, 'scripts/load-server.ts')], {
  cwd: root,
  env: {
    ...process.env,
    NODE_ENV: 'production',
    // One log line per request would cost the server time and fill this runner's buffer.
    LOG_LEVEL: 'warn',
    PORT: '0',
    HOST: '127.0.0.1',
    SPLITCASE_DATA_DIR: join(dataDir, 'data'),
    SPLITCASE_UPLOADS_DIR: join(dataDir, 'uploads'),
    SPLITCASE_DEMO_PASSWORD: PASSWORD,
    SPLITCASE_LOGIN_LIMIT_IP: '100000',
    SPLITCASE_LOGIN_LIMIT_ACCOUNT: '100000',
  },
  stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
});
let serverLog = '';
server.stdout!.on('data', (c: Buffer) => (serverLog += c.toString('utf8')));
server.stderr!.on('data', (c: Buffer) => (serverLog += c.toString('utf8')));
const stopServer = () => {
  if (server.exitCode === null) server.kill('SIGTERM');
};
process.on('exit', () => {
  stopServer();
  rmSync(dataDir, { recursive: true, force: true });
});

interface Memory {
  heapUsed: number;
  rss: number;
  external: number;
  collected: boolean;
}
const memoryWaiters: ((m: Memory) => void)[] = [];
const base = await new Promise<string>((resolve, reject) => {
  server.on('message', (m: { port?: number; memory?: Memory }) => {
    if (m.port) resolve(`http://127.0.0.1:${m.port}`);
    if (m.memory) memoryWaiters.shift()?.(m.memory);
  });
  server.once('exit', (code) => reject(new Error(`The server exited (${code}) before listening:\n${serverLog}`)));
});
/** The server's memory right after a full garbage collection. */
const memoryAfterGc = () =>
  new Promise<Memory>((resolve) => {
    memoryWaiters.push(resolve);
    server.send('memory');
  });
console.log(`Server (pid ${server.pid}) on ${base}, demo workspace seeded in ${dataDir}`);

// ---- sessions ------------------------------------------------------------------------------------
interface Session {
  role: string;
  cookie: string;
  csrf: string;
}
async function signIn(email: string, role: string): Promise<Session> {
  const jar = new Map<string, string>();
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const call = async (method: string, path: string, body?: unknown, csrf?: string) => {
    const res = await fetch(base + path, {
      method,
      headers: { cookie: cookie(), ...(csrf ? { 'x-csrf-token': csrf } : {}), ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair!.indexOf('=');
      jar.set(pair!.slice(0, eq), pair!.slice(eq + 1));
    }
    if (!res.ok) throw new Error(`${method} ${path} as ${email}: ${res.status} ${await res.text()}`);
    return res.json() as Promise<Record<string, unknown>>;
  };
  const first = (await call('GET', '/api/auth/csrf')).token as string;
  await call('POST', '/api/auth/login', { email, password: PASSWORD }, first);
  const csrf = (await call('GET', '/api/auth/csrf')).token as string;
  return { role, cookie: cookie(), csrf };
}
const WHO: [string, string][] = [
  ['engineer@splitcase.test', 'engineer'],
  ['engineer@splitcase.test', 'engineer'],
  ['engineer2@splitcase.test', 'engineer'],
  ['engineer2@splitcase.test', 'engineer'],
  ['lead@splitcase.test', 'lead'],
  ['lead@splitcase.test', 'lead'],
  ['sourcing@splitcase.test', 'sourcing'],
  ['admin@splitcase.test', 'admin'],
  ['viewer@splitcase.test', 'viewer'],
  ['viewer@splitcase.test', 'viewer'],
];
const sessions: Session[] = [];
for (const [email, role] of WHO) sessions.push(await signIn(email, role));

// Records to read and write, found through the API as the engineer sees them.
const get = async (path: string, s: Session) => (await fetch(base + path, { headers: { cookie: s.cookie } })).json() as Promise<Record<string, unknown>>;
const devices = ((await get('/api/devices', sessions[0]!)).devices as { model: string; latestTeardown: { id: number; status: string } | null }[]).filter((d) => d.latestTeardown);
const published = devices.find((d) => d.latestTeardown!.status === 'published')!.latestTeardown!.id;
const draft = devices.find((d) => d.latestTeardown!.status === 'draft')!.latestTeardown!.id;
const runs = (await get(`/api/teardowns/${published}/runs`, sessions[0]!)).runs as { id: number }[];
const runPath = runs.length ? `/api/runs/${runs[0]!.id}/series?maxPoints=500` : `/api/teardowns/${published}/runs`;
console.log(`Reading teardown ${published} (published), writing readings on draft ${draft}; ${CONNECTIONS} connections for ${DURATION_S} s`);

// ---- the mix ---------------------------------------------------------------------------------------
interface Ctx {
  s?: Session;
  measurementId?: number;
}
let nextSession = 0;
const writer = (s: Session) => s.role === 'engineer' || s.role === 'admin';
const commenter = (s: Session) => s.role !== 'viewer';
type Req = { method?: string; path?: string; headers?: Record<string, string>; body?: string };
const as = (ctx: Ctx, req: Req): Req => {
  ctx.s ??= sessions[nextSession++ % sessions.length];
  const s = ctx.s!;
  return { ...req, headers: { cookie: s.cookie, 'x-csrf-token': s.csrf, 'content-type': 'application/json', ...req.headers } };
};
const read = (path: string) => ({ method: 'GET', setupRequest: (req: Req, ctx: Ctx) => as(ctx, { ...req, method: 'GET', path }) });
const requests = [
  read('/api/home'),
  read(`/api/teardowns/${published}`),
  read(`/api/teardowns/${published}/figures`),
  read('/api/search?q=cell'),
  read(runPath),
  {
    setupRequest: (req: Req, ctx: Ctx) => {
      const r = as(ctx, req);
      return commenter(ctx.s!)
        ? { ...r, method: 'POST', path: `/api/teardowns/${published}/comments`, body: JSON.stringify({ body: `Load test remark at ${new Date().toISOString()}` }) }
        : { ...r, method: 'GET', path: '/api/devices' };
    },
  },
  {
    setupRequest: (req: Req, ctx: Ctx) => {
      const r = as(ctx, req);
      return writer(ctx.s!)
        ? { ...r, method: 'POST', path: `/api/teardowns/${draft}/measurements`, body: JSON.stringify({ quantity: 'resistance', value: '4.7 Ω', subject: 'Load test: sense resistor' }) }
        : { ...r, method: 'GET', path: `/api/teardowns/${published}/cost` };
    },
    onResponse: (status: number, body: string, ctx: Ctx) => {
      if (status === 201) ctx.measurementId = (JSON.parse(body) as { measurement: { id: number } }).measurement.id;
    },
  },
  {
    setupRequest: (req: Req, ctx: Ctx) => {
      const r = as(ctx, req);
      const id = ctx.measurementId;
      ctx.measurementId = undefined;
      return writer(ctx.s!) && id ? { ...r, method: 'DELETE', path: `/api/measurements/${id}`, body: undefined } : { ...r, method: 'GET', path: '/api/lineups' };
    },
  },
];

// ---- memory samples --------------------------------------------------------------------------------
const rssMb = () => {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${server.pid}/status`, 'utf8'));
  return m ? Number(m[1]) / 1024 : Number.NaN;
};
const load = (seconds: number, onResponse?: (status: number, ms: number) => void) =>
  new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url: base, connections: CONNECTIONS, duration: seconds, requests: requests as never, timeout: 10 }, (err, res) => (err ? reject(err) : resolve(res)));
    if (onResponse) instance.on('response', (_client, statusCode, _bytes, responseTime) => onResponse(statusCode, responseTime));
  });
const warmUp = new Map<number, number>();
if (WARM_UP_S > 0) {
  console.log(`Warm-up: the same load for ${WARM_UP_S} s, not measured`);
  const w = await load(WARM_UP_S, (status) => warmUp.set(status, (warmUp.get(status) ?? 0) + 1));
  console.log(`  ${w.requests.total} requests, ${w.errors} errors, answers ${JSON.stringify(Object.fromEntries(warmUp))}`);
}

const HEAP_EVERY_S = 10;
const samples: { t: number; mb: number }[] = [];
const heap: { t: number; mb: number }[] = [];
const started = Date.now();
const since = () => (Date.now() - started) / 1000;
const takeHeap = async () => {
  const m = await memoryAfterGc();
  heap.push({ t: since(), mb: m.heapUsed / 1024 / 1024 });
};
await takeHeap();
const sampler = setInterval(() => samples.push({ t: since(), mb: rssMb() }), 1000);
const heapSampler = setInterval(() => void takeHeap(), HEAP_EVERY_S * 1000);

const latencies: number[] = [];
const byStatus = new Map<number, number>();
console.log(`Measured: ${DURATION_S} s`);
const result = await load(DURATION_S, (status, ms) => {
  latencies.push(ms);
  byStatus.set(status, (byStatus.get(status) ?? 0) + 1);
});
clearInterval(sampler);
clearInterval(heapSampler);
await takeHeap();

// ---- report ------------------------------------------------------------------------------------------
latencies.sort((a, b) => a - b);
const pct = (p: number) => latencies[Math.min(latencies.length - 1, Math.floor((p / 100) * latencies.length))] ?? Number.NaN;
const non2xx = [...byStatus].filter(([code]) => code < 200 || code >= 300).reduce((s, [, n]) => s + n, 0);
console.log('\nRequests');
console.table({
  total: latencies.length,
  'per second': Math.round(latencies.length / DURATION_S),
  errors: result.errors,
  timeouts: result.timeouts,
  'non-2xx': non2xx,
  'p50 ms': Math.round(pct(50)),
  'p95 ms': Math.round(pct(95)),
  'p99 ms': Math.round(pct(99)),
  'max ms': Math.round(latencies[latencies.length - 1] ?? Number.NaN),
});
console.log('Answers by status:', Object.fromEntries([...byStatus].sort()));

/** Least-squares slope (MB per second) and mean of a set of samples. */
function fit(points: { t: number; mb: number }[]) {
  const meanT = points.reduce((a, p) => a + p.t, 0) / points.length;
  const meanMb = points.reduce((a, p) => a + p.mb, 0) / points.length;
  const slope = points.reduce((a, p) => a + (p.t - meanT) * (p.mb - meanMb), 0) / points.reduce((a, p) => a + (p.t - meanT) ** 2, 0);
  return { slope, meanMb };
}
const span = heap.length ? heap[heap.length - 1]!.t - heap[0]!.t : 0;
const trend = fit(heap);
const rise = trend.slope * span;
const rss = fit(samples);
console.log('\nServer memory over time (RSS every second; V8 heap in use right after a full collection every 10 s)');
const step = Math.max(1, Math.round(samples.length / 12));
const nearestHeap = (t: number) => heap.reduce((best, h) => (Math.abs(h.t - t) < Math.abs(best.t - t) ? h : best));
console.table(
  samples
    .filter((_, k) => k % step === 0 || k === samples.length - 1)
    .map((s) => ({ 't s': Math.round(s.t), 'RSS MB': s.mb.toFixed(1), 'heap after GC MB': nearestHeap(s.t).mb.toFixed(1), 'heap at s': Math.round(nearestHeap(s.t).t) })),
);
console.log(
  `Heap after GC: ${(trend.slope * 60).toFixed(2)} MB/min over ${span.toFixed(0)} s (${heap.length} samples, after ${WARM_UP_S} s of warm-up) = ${rise.toFixed(1)} MB, ` +
    `${((rise / trend.meanMb) * 100).toFixed(1)} % of the mean ${trend.meanMb.toFixed(1)} MB (limit ${GROWTH_LIMIT * 100} %). RSS: ${(rss.slope * 60).toFixed(2)} MB/min around ${rss.meanMb.toFixed(0)} MB.`,
);

const failures: string[] = [];
const warmNon2xx = [...warmUp].filter(([code]) => code < 200 || code >= 300).reduce((a, [, k]) => a + k, 0);
if (warmNon2xx) failures.push(`${warmNon2xx} answers of the warm-up were not 2xx`);
if (result.errors || result.timeouts) failures.push(`${result.errors} connection errors (${result.timeouts} timeouts)`);
if (non2xx) failures.push(`${non2xx} answers were not 2xx`);
if (heap.length < 4) failures.push('too few memory samples for a trend');
else if (rise > GROWTH_LIMIT * trend.meanMb)
  failures.push(`the heap after GC rose ${rise.toFixed(1)} MB over ${span.toFixed(0)} s (more than ${GROWTH_LIMIT * 100} % of ${trend.meanMb.toFixed(1)} MB)`);
stopServer();
if (failures.length) {
  for (const f of failures) console.log(`✗ ${f}`);
  if (non2xx || result.errors) console.log(serverLog.slice(-4000));
  process.exitCode = 1;
} else console.log('✓ no errors, every answer 2xx, no memory growth trend');
