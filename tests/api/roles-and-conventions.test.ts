import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '@splitcase/contracts';
import { makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(() => t.close());

/**
 * One route of each kind and who may call it. Later modules add their own rows in their tests;
 * this table covers the foundation's kinds: public, any signed-in user, admin only.
 */
const CASES: { kind: string; method: 'get' | 'post' | 'patch'; path: string; body?: unknown; allowed: readonly string[] | 'anyone' }[] = [
  { kind: 'public read', method: 'get', path: '/api/health', allowed: 'anyone' },
  { kind: 'signed-in read', method: 'get', path: '/api/auth/me', allowed: ROLES },
  { kind: 'admin read', method: 'get', path: '/api/users', allowed: ['admin'] },
  { kind: 'admin read (outbox)', method: 'get', path: '/api/outbox', allowed: ['admin'] },
  { kind: 'admin read (audit)', method: 'get', path: '/api/audit', allowed: ['admin'] },
  { kind: 'admin write', method: 'post', path: '/api/invitations', body: { email: 'role-check@example.test', role: 'viewer' }, allowed: ['admin'] },
];

describe('roles are enforced by the server on every route (deny by default)', () => {
  for (const c of CASES) {
    it(`${c.kind}: ${c.method.toUpperCase()} ${c.path}`, async () => {
      const anon = await t.anonymous();
      const anonRes = await (c.method === 'get' ? anon.get(c.path) : anon[c.method](c.path, c.body));
      expect(anonRes.status).toBe(c.allowed === 'anyone' ? 200 : 401);
      for (const role of ROLES) {
        const a = await t.as(role);
        const res = await (c.method === 'get' ? a.get(c.path) : a[c.method](c.path, c.body));
        const allowed = c.allowed === 'anyone' || c.allowed.includes(role);
        if (allowed) expect(res.status, `${role} should be allowed`).toBeLessThan(300);
        else {
          expect(res.status, `${role} should be refused`).toBe(403);
          expect(res.body.error.code).toBe('forbidden');
        }
      }
    });
  }

  it('unknown API paths answer 404 in the standard shape', async () => {
    const a = await t.as('admin');
    const res = await a.get('/api/nothing-here').expect(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: expect.any(String) } });
  });

  it('every mounted route declares who may call it', async () => {
    const { allRoutes } = await import('../../apps/api/src/modules/routes');
    for (const def of allRoutes(t.deps, 'test')) {
      expect(def.spec.access, `${def.spec.method} ${def.spec.path}`).toBeDefined();
    }
  });
});

describe('OpenAPI', () => {
  it('is a 3.1 document generated from the route definitions, with every route in it', async () => {
    const anon = await t.anonymous();
    const doc = (await anon.get('/api/openapi.json').expect(200)).body;
    expect(doc.openapi).toBe('3.1.0');
    const { allRoutes } = await import('../../apps/api/src/modules/routes');
    for (const def of allRoutes(t.deps, 'test')) {
      const path = def.spec.path.replace(/:([A-Za-z_]+)/g, '{$1}');
      expect(doc.paths[path]?.[def.spec.method], `${def.spec.method} ${path}`).toBeDefined();
    }
    expect(doc.paths['/api/auth/login'].post.requestBody.content['application/json'].schema.properties).toHaveProperty('email');
  });

  it('is browsable at /api/docs', async () => {
    const res = await (await t.anonymous()).agent.get('/api/docs/').expect(200);
    expect(res.text).toMatch(/swagger/i);
  });
});

describe('audit log', () => {
  it('records admin changes with who, when and what', async () => {
    const admin = await t.as('admin');
    const users = (await admin.get('/api/users')).body.users as { id: number; email: string }[];
    const eng2 = users.find((u) => u.email === 'engineer2@splitcase.test')!;
    await admin.patch(`/api/users/${eng2.id}`, { role: 'lead' }).expect(200);
    const log = (await admin.get('/api/audit?entityType=user').expect(200)).body.entries;
    expect(log[0]).toMatchObject({ actor: 'Priya Castell', action: 'user.updated', entityId: String(eng2.id), changes: { role: { from: 'engineer', to: 'lead' } } });
    await admin.patch(`/api/users/${eng2.id}`, { role: 'engineer' }).expect(200);
  });
});
