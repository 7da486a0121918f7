import { backupStatusResponse } from '@splitcase/contracts';
import { z } from 'zod';
import { route } from '../../http/route';
import { latestBackup } from './backup';

export const healthResponse = z.object({ ok: z.literal(true), version: z.string(), time: z.string() });

export const systemRoutes = (version: string) => [
  route({ method: 'get', path: '/api/health', tag: 'System', summary: 'Liveness check (no sign-in)', access: 'public', response: healthResponse }, async ({ em }) => {
    await em.getConnection().execute('select 1');
    return { ok: true as const, version, time: new Date().toISOString() };
  }),
  route(
    {
      method: 'get',
      path: '/api/system/backup',
      tag: 'System',
      summary: 'The newest complete backup made by `npm run backup` in the backups folder (null when there is none)',
      access: ['admin'],
      response: backupStatusResponse,
    },
    async ({ deps }) => ({ lastBackup: latestBackup(deps.env) }),
  ),
];
