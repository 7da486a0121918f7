// MikroORM configuration for tools (the CLI through tsx). The app builds the same config in
// apps/api/src/db/orm-config.ts from its validated environment.
import { readEnv } from './apps/api/src/config/env';
import { ormConfig } from './apps/api/src/db/orm-config';

export default ormConfig(readEnv().dbPath);
