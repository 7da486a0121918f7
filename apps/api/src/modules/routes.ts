// Every API route, module by module. A new module adds its list here (one line each).
import type { AppDeps } from '../http/deps';
import type { RouteDef } from '../http/route';
import { auditRoutes } from './audit/routes';
import { deviceRoutes } from './devices/routes';
import { figureRoutes } from './figures/routes';
import { findingRoutes } from './findings/routes';
import { authRoutes } from './auth/routes';
import { costRoutes } from './cost/routes';
import { mailRoutes } from './mail/routes';
import { measurementRoutes } from './measurements/routes';
import { partRoutes } from './parts/routes';
import { photoRoutes } from './photos/routes';
import { powerRoutes } from './power/routes';
import { modeRoutes } from './power/modes.routes';
import { settingsRoutes } from './settings/routes';
import { systemRoutes } from './system/routes';
import { teardownRoutes } from './teardowns/routes';
import { toolRoutes } from './tools/routes';
import { userRoutes } from './users/routes';
import { runRoutes } from './runs/routes';
import { searchRoutes } from './search/routes';
import { lineupRoutes } from './lineups/routes';
import { homeRoutes } from './home/routes';

export function allRoutes(deps: AppDeps, version: string): RouteDef[] {
  return [
    ...systemRoutes(version),
    ...authRoutes(deps),
    ...userRoutes,
    ...mailRoutes,
    ...auditRoutes,
    ...settingsRoutes,
    ...teardownRoutes,
    ...deviceRoutes,
    ...findingRoutes,
    ...figureRoutes,
    ...photoRoutes(deps),
    ...toolRoutes,
    ...partRoutes,
    ...powerRoutes,
    ...modeRoutes,
    ...measurementRoutes,
    ...costRoutes,
    ...runRoutes(deps),
    ...searchRoutes,
    ...lineupRoutes,
    ...homeRoutes,
  ];
}
