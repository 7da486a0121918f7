import { idParam, teardownResponse } from '@splitcase/contracts';
import { route, type RouteDef } from '../../http/route';
import { readableTeardown } from './access';
import { toTeardownDto } from './dto';

export const teardownRoutes: RouteDef[] = [
  route(
    {
      method: 'get',
      path: '/api/teardowns/:id',
      tag: 'Teardowns',
      summary: 'One teardown with what the caller may do with it (viewers: published only)',
      access: 'signed-in',
      params: idParam,
      response: teardownResponse,
    },
    async ({ em, user, params }) => ({ teardown: toTeardownDto(await readableTeardown(em, user, params.id), user) }),
  ),
];
