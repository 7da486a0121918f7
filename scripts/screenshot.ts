// Developer tool: sign in as a demo user and save full-page screenshots of app pages.
// Usage: tsx scripts/screenshot.ts <baseUrl> <role|-> <outDir> <path> [path…]
//   role "-" means signed out. The demo password comes from SPLITCASE_DEMO_PASSWORD (default splitcase-demo).
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium } from 'playwright-core';

const [base, role, outDir, ...pagePaths] = process.argv.slice(2);
if (!base || !role || !outDir || pagePaths.length === 0) {
  console.error('Usage: tsx scripts/screenshot.ts <baseUrl> <role|-> <outDir> <path> [path…]');
  process.exit(2);
}
mkdirSync(outDir, { recursive: true });
const browser = await chromium.launch({
  executablePath: process.env.SPLITCASE_CHROMIUM ?? '/usr/bin/chromium',
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
if (role !== '-') {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(`${role}@splitcase.test`);
  await page.getByLabel('Password').fill(process.env.SPLITCASE_DEMO_PASSWORD ?? 'splitcase-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}
for (const p of pagePaths) {
  await page.goto(base + p);
  await page.waitForLoadState('networkidle');
  await page.waitForTimeout(400);
  const file = join(outDir, `${role}${p.replace(/[^a-z0-9]+/gi, '_') || '_home'}.png`);
  await page.screenshot({ path: file, fullPage: true });
  console.log(file);
}
await browser.close();
