import { settingsResponse, updateSettingsBody } from '@splitcase/contracts';
import { forbidden } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { getSettings, updateSettings } from './settings.service';

/** The settings sourcing owns (currencies); the rest are admin's. */
const SOURCING_SETTINGS: readonly string[] = ['reportingCurrency', 'salesTaxByCurrency'];

export const settingsRoutes: RouteDef[] = [
  route({ method: 'get', path: '/api/settings', tag: 'Settings', summary: 'Workspace settings', access: 'signed-in', response: settingsResponse }, async ({ em }) => ({
    settings: await getSettings(em),
  })),
  route(
    {
      method: 'patch',
      path: '/api/settings',
      tag: 'Settings',
      summary: 'Change workspace settings (admin; sourcing may change the reporting currency and the sales tax by currency)',
      access: ['admin', 'sourcing'],
      body: updateSettingsBody,
      response: settingsResponse,
    },
    async ({ em, user, body }) => {
      if (user.role === 'sourcing' && Object.entries(body).some(([k, v]) => v !== undefined && !SOURCING_SETTINGS.includes(k)))
        throw forbidden('Sourcing may change only the reporting currency and the sales tax by currency.');
      return { settings: await updateSettings(em, user, body) };
    },
  ),
];
