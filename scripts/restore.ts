// `npm run restore <folder>`: put a backup back (a folder path, or a folder name inside
// SPLITCASE_BACKUPS_DIR). Refuses while a server runs on the data folder (stop it first) and when
// any file does not match the manifest. The data it replaces is moved aside, not deleted.
import { readEnv } from '../apps/api/src/config/env';
import { backupFolder, restoreBackup } from '../apps/api/src/modules/system/backup';

const given = process.argv[2];
if (!given) {
  console.error('Usage: npm run restore <backup folder>   (e.g. npm run restore 2026-12-03T08-45-00Z)');
  process.exit(2);
}
const env = readEnv();
try {
  const folder = backupFolder(env, given);
  const { manifest, setAside } = await restoreBackup(env, folder);
  console.log(`Restored the backup of ${manifest.createdAt} from ${folder}`);
  console.log(`  ${manifest.files.length} files checked against their SHA-256; ${manifest.photos} photos, ${manifest.runs} bench runs`);
  if (setAside.length) console.log(`  the data it replaced was moved to ${setAside.join(' and ')}; delete it once you have checked the restore`);
  console.log('  start the server again with npm start');
} catch (err) {
  console.error(`Restore refused: ${(err as Error).message}`);
  process.exitCode = 1;
}
