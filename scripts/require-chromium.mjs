// npm test needs Debian's Chromium for the browser tests; say how to get it in one line.
import { existsSync } from 'node:fs';
const path = process.env.SPLITCASE_CHROMIUM ?? '/usr/bin/chromium';
if (!existsSync(path)) {
  console.error(`Chromium not found at ${path}: install it with "sudo apt-get install -y chromium" (or set SPLITCASE_CHROMIUM), then run npm test again.`);
  process.exit(1);
}
