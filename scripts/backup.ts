// `npm run backup`: a consistent online copy of the database, the sessions database and the upload
// files into a new dated folder of SPLITCASE_BACKUPS_DIR (default ./backups), with a manifest of row
// counts and SHA-256 hashes. Safe while the server runs.
import { readEnv } from '../apps/api/src/config/env';
import { APP_VERSION } from '../apps/api/src/http/create-app';
import { createBackup } from '../apps/api/src/modules/system/backup';

const env = readEnv();
try {
  const started = Date.now();
  const { folder, manifest } = await createBackup(env, { appVersion: APP_VERSION });
  const bytes = manifest.files.reduce((s, f) => s + f.bytes, 0);
  const rows = Object.values(manifest.tables).reduce((s, n) => s + n, 0);
  console.log(`Backup written to ${folder}`);
  console.log(
    `  ${manifest.files.length} files, ${(bytes / 1024 / 1024).toFixed(1)} MB; ${rows.toLocaleString('en-GB')} rows in ${Object.keys(manifest.tables).length} tables; ${manifest.photos} photos, ${manifest.runs} bench runs`,
  );
  console.log(`  took ${((Date.now() - started) / 1000).toFixed(1)} s. Restore with: npm run restore ${folder}`);
} catch (err) {
  console.error(`Backup failed: ${(err as Error).message}`);
  process.exitCode = 1;
}
