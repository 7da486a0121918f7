import { homeResponse } from '@splitcase/contracts';
import { route, type RouteDef } from '../../http/route';
import { homeFor } from './home.service';

export const homeRoutes: RouteDef[] = [
  route(
    {
      method: 'get',
      path: '/api/home',
      tag: 'Home',
      summary:
        "What the caller's role needs first (engineer: drafts, sent back, in review; lead: waiting for review, major and critical findings; sourcing: unpriced parts, rate age; admin: users, invitations, outbox), plus recent published teardowns and findings (viewers: published only)",
      access: 'signed-in',
      response: homeResponse,
    },
    async ({ em, user, deps }) => homeFor(em, user, deps),
  ),
];
