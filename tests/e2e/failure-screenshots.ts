// Every browser test: when a test fails, a screenshot of each page still open in any browser launched
// through `launch()` is kept under test-results/e2e/ (the artifact CI keeps), named after the test.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { beforeEach } from 'vitest';
import { openBrowsers } from './browser';

const outDir = join(process.cwd(), 'test-results', 'e2e');

const slug = (text: string) =>
  text
    .replace(/[^a-z0-9]+/gi, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 120);

beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    mkdirSync(outDir, { recursive: true });
    const name = slug(`${task.file?.name ?? ''} ${task.name}`);
    let n = 0;
    for (const browser of openBrowsers()) {
      for (const context of browser.contexts()) {
        for (const page of context.pages()) {
          n += 1;
          const path = join(outDir, `${name}-${n}.png`);
          await page.screenshot({ path, fullPage: true, timeout: 10_000 }).catch(() => undefined);
        }
      }
    }
  });
});
