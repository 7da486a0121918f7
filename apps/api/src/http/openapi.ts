import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { errorBodySchema } from '@splitcase/contracts';
import { z } from 'zod';
import { PRICE_READERS } from '../modules/cost/price-visibility';
import type { RouteDef } from './route';

const ERROR_RESPONSES: Record<string, string> = {
  '400': 'Validation failed (fields name the inputs)',
  '401': 'Not signed in',
  '403': 'Role not allowed, or CSRF token missing/wrong',
  '404': 'Not found',
  '409': 'Stale version or conflicting state',
  '413': 'Too large',
  '415': 'Unsupported media type',
  '422': 'Valid input that the calculation cannot accept',
  '429': 'Rate limited (Retry-After)',
};

/** The OpenAPI 3.1 document, generated from the same route definitions and schemas the server validates with. */
export function buildOpenApi(defs: RouteDef[], version: string) {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'splitcase.sid' });
  registry.registerComponent('securitySchemes', 'csrf', { type: 'apiKey', in: 'header', name: 'X-CSRF-Token' });
  for (const { spec } of defs) {
    const path = spec.path.replace(/:([A-Za-z_]+)/g, '{$1}');
    const stateChanging = spec.method !== 'get';
    const access = spec.access === 'public' ? 'Anyone (no sign-in)' : spec.access === 'signed-in' ? 'Any signed-in user' : `Roles: ${spec.access.join(', ')}`;
    const errors = Object.fromEntries(
      Object.entries(ERROR_RESPONSES)
        .filter(([code]) => spec.access !== 'public' || (code !== '401' && code !== '403') || stateChanging)
        .map(([code, description]) => [code, { description, content: { 'application/json': { schema: errorBodySchema } } }]),
    );
    const status = String(spec.status ?? 200);
    const ok = spec.produces
      ? { description: 'OK', content: { [spec.produces]: { schema: z.string() } } }
      : spec.response
        ? { description: 'OK', content: { 'application/json': { schema: spec.response } } }
        : { description: 'Done (no body)' };
    registry.registerPath({
      method: spec.method,
      path,
      tags: [spec.tag],
      summary: spec.summary,
      description: `Access: ${access}.${spec.prices ? ` Price detail (breaks, quote sources and confidence, line prices, price history) only for ${PRICE_READERS.join(', ')}; others get the totals.` : ''}${stateChanging ? ' Needs the X-CSRF-Token header.' : ''}`,
      security: spec.access === 'public' ? [] : [{ session: [], ...(stateChanging ? { csrf: [] } : {}) }],
      request: {
        ...(spec.params ? { params: spec.params as never } : {}),
        ...(spec.query ? { query: spec.query as never } : {}),
        ...(spec.body ? { body: { content: { 'application/json': { schema: spec.body } } } } : {}),
        ...(spec.multipart
          ? {
              body: {
                content: {
                  'multipart/form-data': {
                    schema: z.object(Object.fromEntries(Object.entries(spec.multipart).map(([k, t]) => [k, t === 'file' ? z.string().meta({ format: 'binary' }) : z.string()]))),
                  },
                },
              },
            }
          : {}),
      },
      responses: { [spec.status === undefined && !spec.response && !spec.produces ? '204' : status]: ok, ...errors },
    });
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Splitcase API',
      version,
      description: 'JSON over /api with a session cookie. Every state-changing request carries the X-CSRF-Token header from GET /api/auth/csrf. Errors: { error: { code, message, fields? } }.',
    },
    servers: [{ url: '/' }],
  });
}
