// Helpers for browser tests: Debian's Chromium through playwright-core, and sign-in as a demo user.
import { chromium, type Browser, type Page } from 'playwright-core';
import { inject } from 'vitest';
import { E2E_PASSWORD } from './password';

export const baseUrl = () => inject('baseUrl');

const browsers = new Set<Browser>();

/** Browsers launched by this test file and still open (failure-screenshots.ts photographs their pages). */
export const openBrowsers = (): Browser[] => [...browsers].filter((b) => b.isConnected());

export async function launch(): Promise<Browser> {
  const browser = await chromium.launch({
    executablePath: process.env.SPLITCASE_CHROMIUM ?? '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'],
  });
  browsers.add(browser);
  browser.on('disconnected', () => browsers.delete(browser));
  return browser;
}

/** A fresh browser context (own cookies) signed in as a demo user (`engineer`, `lead`…). */
export async function signedInPage(browser: Browser, role: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, baseURL: baseUrl() });
  const page = await context.newPage();
  await signIn(page, role);
  return page;
}

export async function signIn(page: Page, role: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(role.includes('@') ? role : `${role}@splitcase.test`);
  await page.getByLabel('Password').fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}
