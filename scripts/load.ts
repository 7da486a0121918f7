// `npm run load`: a bounded load test on loopback only. Starts the API in a child process on
// 127.0.0.1 over a throwaway copy of the demo workspace, signs in ten sessions across the roles,
// and drives it with autocannon: 50 connections (each keeps one session) cycling through reads
// (home, a teardown, its figures and cost, search, a run's chart series, lineups) and writes (a
// comment; a reading added and removed again on a draft) for 60 s, or 10 minutes with --soak.
// Reports errors, latency p50/p95/p99, and the server's resident memory (RSS, from /proc, Linux)
// sampled every second. Passes when there are no errors, no non-2xx answers, and no memory growth:
// a least-squares line through the samples after the first 20 % (warm-up) rises by less than 5 % of
// their mean over the window. Exit code 1 otherwise. Not part of `npm test`.
//   --soak            10 minutes instead of 60 s
//   --duration <s>    any other length
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
const WARM_UP = 0.2;
const GROWTH_LIMIT = 0.05;
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const PASSWORD = 'load-test-password';

// ---- the server, in a child process on loopback -------------------------------------------------
const dataDir = mkdtempSync(join(tmpdir(), 'splitcase-load-'));
const server = spawn(process.execPath, ['--import', 'tsx', join(root, 'apps/api/src/main.ts')], {
  cwd: root,
  env: {
    ...process.env,
    NODE_ENV: 'production',
    PORT: '0',
    HOST: '127.0.0.1',
    SPLITCASE_DATA_DIR: join(dataDir, 'data'),
    SPLITCASE_UPLOADS_DIR: join(dataDir, 'uploads'),
    SPLITCASE_DEMO_PASSWORD: PASSWORD,
    SPLITCASE_LOGIN_LIMIT_IP: '100000',
    SPLITCASE_LOGIN_LIMIT_ACCOUNT: '100000',
  },
  stdio: ['ignore', 'pipe', 'pipe'],
});
let serverLog = '';
server.stderr!.on('data', (c: Buffer) => (serverLog += c.toString('utf8')));
const stopServer = () => {
  if (server.exitCode === null) server.kill('SIGTERM');
};
process.on('exit', () => {
  stopServer();
  rmSync(dataDir, { recursive: true, force: true });
});

const base = await new Promise<string>((resolve, reject) => {
  let out = '';
  server.stdout!.on('data', (c: Buffer) => {
    out += c.toString('utf8');
    const m = /Splitcase API on http:\/\/localhost:(\d+)/.exec(out);
    if (m) resolve(`http://127.0.0.1:${m[1]}`);
  });
  server.once('exit', (code) => reject(new Error(`The server exited (${code}) before listening:\n${serverLog}`)));
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
const samples: { t: number; mb: number }[] = [];
const started = Date.now();
const sampler = setInterval(() => samples.push({ t: (Date.now() - started) / 1000, mb: rssMb() }), 1000);

const latencies: number[] = [];
const byStatus = new Map<number, number>();
const result = await new Promise<autocannon.Result>((resolve, reject) => {
  const instance = autocannon({ url: base, connections: CONNECTIONS, duration: DURATION_S, requests: requests as never, timeout: 10 }, (err, res) => (err ? reject(err) : resolve(res)));
  instance.on('response', (_client, statusCode, _bytes, responseTime) => {
    latencies.push(responseTime);
    byStatus.set(statusCode, (byStatus.get(statusCode) ?? 0) + 1);
  });
});
clearInterval(sampler);

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

const steady = samples.filter((s) => s.t >= DURATION_S * WARM_UP);
const n = steady.length;
const meanT = steady.reduce((a, s) => a + s.t, 0) / n;
const meanMb = steady.reduce((a, s) => a + s.mb, 0) / n;
const slope = steady.reduce((a, s) => a + (s.t - meanT) * (s.mb - meanMb), 0) / steady.reduce((a, s) => a + (s.t - meanT) ** 2, 0);
const window = steady.length ? steady[n - 1]!.t - steady[0]!.t : 0;
const rise = slope * window;
console.log('\nServer memory (RSS, MB) over time');
const step = Math.max(1, Math.round(samples.length / 12));
console.table(samples.filter((_, k) => k % step === 0 || k === samples.length - 1).map((s) => ({ 't s': Math.round(s.t), 'RSS MB': s.mb.toFixed(1) })));
console.log(
  `Trend after the ${Math.round(WARM_UP * 100)} % warm-up: ${(slope * 60).toFixed(2)} MB/min over ${window.toFixed(0)} s (${n} samples) = ${rise.toFixed(1)} MB, ` +
    `${((rise / meanMb) * 100).toFixed(1)} % of the mean ${meanMb.toFixed(1)} MB (limit ${GROWTH_LIMIT * 100} %)`,
);

const failures: string[] = [];
if (result.errors || result.timeouts) failures.push(`${result.errors} connection errors (${result.timeouts} timeouts)`);
if (non2xx) failures.push(`${non2xx} answers were not 2xx`);
if (!(n >= 5)) failures.push('too few memory samples for a trend');
else if (rise > GROWTH_LIMIT * meanMb) failures.push(`memory grew ${rise.toFixed(1)} MB over the window (more than ${GROWTH_LIMIT * 100} % of ${meanMb.toFixed(1)} MB)`);
stopServer();
if (failures.length) {
  for (const f of failures) console.log(`✗ ${f}`);
  if (non2xx || result.errors) console.log(serverLog.slice(-4000));
  process.exitCode = 1;
} else console.log('✓ no errors, every answer 2xx, no memory growth trend');
