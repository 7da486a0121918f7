// Every API route, module by module. A new module adds its list here.
import type { AppDeps } from '../http/deps';
import type { RouteDef } from '../http/route';
import { auditRoutes } from './audit/routes';
import { deviceRoutes } from './devices/routes';
import { figureRoutes } from './figures/routes';
import { findingRoutes } from './findings/routes';
import { authRoutes } from './auth/routes';
import { mailRoutes } from './mail/routes';
import { settingsRoutes } from './settings/routes';
import { systemRoutes } from './system/routes';
import { teardownRoutes } from './teardowns/routes';
import { userRoutes } from './users/routes';

export function allRoutes(deps: AppDeps, version: string): RouteDef[] {
  return [...systemRoutes(version), ...authRoutes(deps), ...userRoutes, ...mailRoutes, ...auditRoutes, ...settingsRoutes, ...teardownRoutes, ...deviceRoutes, ...findingRoutes, ...figureRoutes];
}
