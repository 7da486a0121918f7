// A real server in a child process, for tests that kill it (SIGKILL) and start it again. Configured
// from the environment like `npm start` (SPLITCASE_DATA_DIR, SPLITCASE_UPLOADS_DIR, PORT, HOST), no
// seeding. Prints "LISTENING <port>" when it serves. With a pause point as the first argument it
// stops dead at that point of an upload, prints "PAUSED <point>" and blocks until it is killed:
//   photo-staged      the photo's three files are written, its row is not committed
//   photo-committed   the row is committed, the files are not yet moved into place
//   run-staged        the log and its series are written, the run's row is not committed
//   run-committed     the row is committed, the run's folder is not yet moved into place
import { writeSync } from 'node:fs';
import { sep } from 'node:path';
import { readEnv } from '../../apps/api/src/config/env';
import { fileOps } from '../../apps/api/src/modules/photos/photo-files';
import { runFileOps } from '../../apps/api/src/modules/runs/storage';
import { startServer } from '../../apps/api/src/server';

const pause = process.argv[2];

/** Say where we are, then block the whole process until it is killed. */
function stopDead(point: string): never {
  writeSync(1, `PAUSED ${point}\n`);
  for (;;) Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0);
}

const incoming = `${sep}.incoming${sep}`;
if (pause === 'photo-staged') {
  const write = fileOps.writeFile;
  fileOps.writeFile = (async (...args: Parameters<typeof write>) => {
    await write(...args);
    if (String(args[0]).endsWith('thumb.webp')) stopDead(pause);
  }) as typeof write;
}
if (pause === 'photo-committed') {
  const rename = fileOps.rename;
  fileOps.rename = (async (from, to) => {
    if (String(from).includes(incoming)) stopDead(pause);
    return rename(from, to);
  }) as typeof rename;
}
if (pause === 'run-staged' || pause === 'run-committed') {
  const rename = runFileOps.rename;
  runFileOps.rename = (from, to) => {
    // Into the staging folder: the raw log joins the series. Out of it: the run is published.
    const intoStaging = String(to).includes(incoming);
    if (pause === 'run-committed' && !intoStaging) stopDead(pause);
    rename(from, to);
    if (pause === 'run-staged' && intoStaging) stopDead(pause);
  };
}

const running = await startServer(readEnv(), { seed: false, log: () => {} });
writeSync(1, `LISTENING ${running.port}\n`);
const stop = () => running.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
