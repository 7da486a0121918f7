import { settingsResponse, updateSettingsBody } from '@splitcase/contracts';
import { forbidden } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { getSettings, updateSettings } from './settings.service';

export const settingsRoutes: RouteDef[] = [
  route(
    { method: 'get', path: '/api/settings', tag: 'Settings', summary: 'Workspace settings', access: 'signed-in', response: settingsResponse },
    async ({ em }) => ({ settings: await getSettings(em) }),
  ),
  route(
    {
      method: 'patch',
      path: '/api/settings',
      tag: 'Settings',
      summary: 'Change workspace settings (admin; sourcing may change the reporting currency)',
      access: ['admin', 'sourcing'],
      body: updateSettingsBody,
      response: settingsResponse,
    },
    async ({ em, user, body }) => {
      if (user.role === 'sourcing' && Object.entries(body).some(([k, v]) => v !== undefined && k !== 'reportingCurrency')) throw forbidden('Sourcing may change only the reporting currency.');
      return { settings: await updateSettings(em, user, body) };
    },
  ),
];
