// The home page of each demo role, and the printable teardown report on screen, in print and as a PDF.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PhotoDto } from '@splitcase/contracts';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** The latest teardown of a demo device, by model, through the API as the signed-in user. */
async function teardownOf(page: Page, model: string): Promise<number> {
  const res = await page.request.get(`/api/devices?q=${encodeURIComponent(model)}`);
  const devices = (await res.json()).devices as { model: string; latestTeardown: { id: number } | null }[];
  const d = devices.find((x) => x.model === model);
  if (!d?.latestTeardown) throw new Error(`No teardown of ${model}`);
  return d.latestTeardown.id;
}

async function openHome(role: string): Promise<Page> {
  const page = await signedInPage(browser, role);
  await page.goto('/');
  await page.getByTestId('needs').waitFor();
  return page;
}

const block = (page: Page, id: string) => page.locator(`section[data-block="${id}"]`);
const blockIds = (page: Page) => page.locator('section[data-block]').evaluateAll((els) => els.map((e) => e.getAttribute('data-block')));

describe('home for each role', () => {
  it('engineer: their drafts and teardowns in review, then what is new', async () => {
    const page = await openHome('engineer');
    await expect.poll(() => page.getByTestId('needs').textContent(), { timeout: 10_000 }).toMatch(/draft/);
    await expect.poll(() => block(page, 'drafts').textContent(), { timeout: 10_000 }).toContain('Pellam Works Stackcell 20 PD');
    await expect.poll(() => block(page, 'in-review').textContent(), { timeout: 10_000 }).toContain('Halvix HandGlow Pro 2');
    const ids = await blockIds(page);
    expect(ids).toEqual(expect.arrayContaining(['drafts', 'in-review', 'recent-teardowns', 'recent-findings']));
    expect(ids).not.toContain('reviews');
    expect(ids).not.toContain('unpriced');
    // A draft links into its teardown.
    await block(page, 'drafts')
      .getByRole('link', { name: /Stackcell 20 PD/ })
      .click();
    await page.waitForURL(/\/teardowns\/\d+$/);
    await page.getByRole('heading', { name: /Stackcell 20 PD/ }).waitFor();
    await page.context().close();
  });

  it('lead: the teardowns waiting for review, oldest first, and the major and critical findings', async () => {
    const page = await openHome('lead');
    await expect.poll(() => page.getByTestId('needs').textContent(), { timeout: 10_000 }).toMatch(/waiting for your review/);
    const rows = await block(page, 'reviews').locator('tbody tr').allTextContents();
    const pro = rows.findIndex((r) => r.includes('Halvix HandGlow Pro 2'));
    const neck = rows.findIndex((r) => r.includes('Corvane Breeze Neck 2'));
    expect(pro).toBeGreaterThanOrEqual(0);
    expect(neck).toBeGreaterThan(pro);
    expect(rows[pro]).toContain('Tomas Reyne');
    const severities = await block(page, 'severe-findings')
      .locator('li[data-finding]')
      .evaluateAll((lis) => lis.map((li) => li.textContent ?? ''));
    expect(severities.length).toBeGreaterThan(0);
    for (const s of severities) expect(s).toMatch(/^(Major|Critical)/);
    await page.context().close();
  });

  it('sourcing: parts without a price and the age of the rates', async () => {
    const page = await openHome('sourcing');
    const ids = await blockIds(page);
    expect(ids).toEqual(expect.arrayContaining(['unpriced', 'rates', 'recent-teardowns']));
    const rates = await (await page.request.get('/api/rates')).json();
    await expect.poll(() => page.getByTestId('rates-age').textContent(), { timeout: 10_000 }).toMatch(/days? old|today/);
    const d = new Date(`${rates.current.date}T12:00:00Z`).toLocaleDateString('en-GB', { year: 'numeric', month: 'short', day: 'numeric' });
    await expect.poll(() => page.getByTestId('rates-age').textContent(), { timeout: 10_000 }).toContain(d);
    await page.context().close();
  });

  it('admin: the team by role, invitations and the outbox', async () => {
    const page = await openHome('admin');
    const ids = await blockIds(page);
    expect(ids).toEqual(expect.arrayContaining(['team', 'invitations', 'outbox']));
    await expect.poll(() => page.locator('[data-role-count="engineer"]').textContent(), { timeout: 10_000 }).toMatch(/^\d+$/);
    expect(Number(await page.locator('[data-role-count="admin"]').textContent())).toBeGreaterThanOrEqual(1);
    await page.context().close();
  });

  it('viewer: no role blocks, the published teardowns and their findings', async () => {
    const page = await openHome('viewer');
    const ids = await blockIds(page);
    expect(ids.sort()).toEqual(['recent-findings', 'recent-teardowns']);
    await expect.poll(() => page.getByTestId('needs').textContent(), { timeout: 10_000 }).toMatch(/Nothing needs you/);
    const published = await block(page, 'recent-teardowns').locator('tbody tr').allTextContents();
    expect(published.some((r) => r.includes('Halvix HandGlow Duo 10'))).toBe(true);
    expect(published.some((r) => r.includes('HandGlow Pro 2'))).toBe(false);
    await page.context().close();
  });
});

describe('printable teardown report', () => {
  it('an engineer opens the report from the teardown: photos with pins in place, the BOM, figures with sources, cautions', async () => {
    const page = await signedInPage(browser, 'engineer');
    const id = await teardownOf(page, 'HandGlow Pro 2');
    await page.goto(`/teardowns/${id}`);
    await page.getByRole('link', { name: 'Print report' }).click();
    await page.waitForURL(new RegExp(`/teardowns/${id}/report$`));
    await page.locator('[data-testid="report"][data-ready="true"]').waitFor();
    await page.waitForFunction(() => Array.from(document.images).every((i) => i.complete && i.naturalWidth > 0));

    // No navigation rails: the report is its own page.
    await expect(page.getByRole('navigation', { name: 'Main' }).count()).resolves.toBe(0);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent(), { timeout: 10_000 }).toBe('Halvix HandGlow Pro 2');

    // Photos with their pins, each pin centred on its recorded spot.
    const photos = (await (await page.request.get(`/api/teardowns/${id}/photos`)).json()).photos as PhotoDto[];
    const stages = page.getByTestId('pinned-photo');
    await expect.poll(() => stages.count(), { timeout: 10_000 }).toBe(photos.length);
    for (const [i, photo] of photos.entries()) {
      const box = (await stages.nth(i).boundingBox())!;
      for (const c of photo.callouts) {
        const pin = (await stages.nth(i).locator(`[data-pin="${c.number}"]`).boundingBox())!;
        expect(Math.abs(pin.x + pin.width / 2 - (box.x + c.x * box.width)), `photo ${i + 1} pin ${c.number} x`).toBeLessThan(1.5);
        expect(Math.abs(pin.y + pin.height / 2 - (box.y + c.y * box.height)), `photo ${i + 1} pin ${c.number} y`).toBeLessThan(1.5);
      }
      await expect.poll(() => page.locator(`figure[data-photo="${photo.id}"] [data-key-pin]`).count(), { timeout: 10_000 }).toBe(photo.callouts.length);
    }

    // The BOM with every part, and prices at the default volume.
    const parts = (await (await page.request.get(`/api/teardowns/${id}/parts`)).json()).parts as unknown[];
    const bom = page.getByRole('table', { name: 'Parts' });
    await expect.poll(() => bom.locator('tbody tr[data-part]').count(), { timeout: 10_000 }).toBe(parts.length);
    await expect.poll(() => bom.locator('thead').textContent(), { timeout: 10_000 }).toMatch(/Unit price, [A-Z]{3}/);
    await expect.poll(() => page.getByTestId('bom-total').textContent(), { timeout: 10_000 }).toMatch(/Parts at [\d,]+ units/);

    // Figures with their formula and source.
    const figures = (await (await page.request.get(`/api/teardowns/${id}/figures`)).json()).figures as { key: string; source: string }[];
    expect(figures.length).toBeGreaterThan(0);
    for (const f of figures.slice(0, 5)) {
      await expect.poll(() => page.locator(`tr[data-figure="${f.key}"] [data-testid="figure-source"]`).textContent(), { timeout: 10_000 }).toBe(f.source);
    }

    // Findings grouped by severity, then the cautions and the estimates note.
    await expect(page.locator('[data-section="findings"] [data-severity]').count()).resolves.toBeGreaterThan(0);
    const safety = page.locator('[data-section="safety"]');
    await expect.poll(() => safety.getByText('Lithium cell: before you open the case').count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => safety.getByText(/Engineering estimates, not certification results/).count(), { timeout: 10_000 }).toBe(1);

    // In print the toolbar goes.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByRole('button', { name: 'Print / Save as PDF' }).isVisible()).resolves.toBe(false);
    await page.emulateMedia({ media: 'screen' });
    await expect.poll(() => page.getByRole('button', { name: 'Print / Save as PDF' }).isEnabled(), { timeout: 10_000 }).toBe(true);

    // As a PDF: several A4 pages.
    const pdf = await page.pdf({ format: 'A4', printBackground: true, preferCSSPageSize: true });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length;
    expect(pages).toBeGreaterThan(1);
    await page.context().close();
  });

  it('a viewer cannot open the report of a teardown that is not published', async () => {
    const engineer = await signedInPage(browser, 'engineer');
    const draft = await teardownOf(engineer, 'Stackcell 20 PD');
    await engineer.context().close();
    const page = await signedInPage(browser, 'viewer');
    await page.goto(`/teardowns/${draft}/report`);
    await page.getByRole('alert').waitFor();
    await expect.poll(() => page.getByRole('alert').textContent(), { timeout: 10_000 }).toMatch(/not found/i);
    await expect(page.getByTestId('report').count()).resolves.toBe(0);
    await page.context().close();
  });
});
