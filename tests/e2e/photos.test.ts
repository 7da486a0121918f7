import type { Browser, Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PhotoDto } from '@splitcase/contracts';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** The id of a demo teardown by device model, through the API as the signed-in user. */
async function teardownIdByModel(page: Page, model: string): Promise<number> {
  for (let id = 1; id <= 40; id++) {
    const res = await page.request.get(`/api/teardowns/${id}`);
    if (res.ok() && (await res.json()).teardown.device.model === model) return id;
  }
  throw new Error(`No teardown of ${model}`);
}

async function csrf(page: Page): Promise<string> {
  return (await (await page.request.get('/api/auth/csrf')).json()).token;
}

/** A part to link the pin to: through the parts API when this build has it; null otherwise (label-only pin). */
async function tryCreatePart(page: Page, teardownId: number): Promise<{ id: number } | null> {
  const res = await page.request.post(`/api/teardowns/${teardownId}/parts`, {
    headers: { 'X-CSRF-Token': await csrf(page) },
    data: { designator: 'U9', category: 'ic', description: 'Bench test charger IC (e2e)', quantity: 1, mount: 'smt' },
  });
  return res.status() === 201 ? (await res.json()).part : null;
}

/** A JPEG of about a megabyte (noise compresses badly), so the upload takes more than one progress event. */
async function benchJpeg(seed: number): Promise<Buffer> {
  const w = 1400;
  const h = 1000;
  const raw = Buffer.alloc(w * h * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = ((i * 2654435761 + seed * 97) >>> 24) & 0xff;
  return sharp(raw, { raw: { width: w, height: h, channels: 3 } })
    .jpeg({ quality: 80 })
    .toBuffer();
}

describe('photos and callouts in the browser', () => {
  it('an engineer uploads two photos with progress, places a pin, drags it and sees it on the thumbnail', async () => {
    const page = await signedInPage(browser, 'engineer');
    const teardownId = await teardownIdByModel(page, 'Trailbeam C3');
    const part = await tryCreatePart(page, teardownId);
    await page.goto(`/teardowns/${teardownId}/photos`);
    await page.getByTestId('photo-dropzone').waitFor();

    // Two files through the file chooser of the drop zone; a third, a text file, is refused before sending.
    const files = [
      { name: 'e2e-board-top.jpg', mimeType: 'image/jpeg', buffer: await benchJpeg(1) },
      { name: 'e2e-board-bottom.jpg', mimeType: 'image/jpeg', buffer: await benchJpeg(2) },
      { name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('not a photo') },
    ];
    await page.getByTestId('photo-file-input').setInputFiles(files);
    const rows = page.getByTestId('upload-row');
    await expect.poll(() => rows.count()).toBe(3);
    await page.getByText('notes.txt').waitFor();
    await expect.poll(() => rows.filter({ hasText: 'notes.txt' }).textContent(), { timeout: 10_000 }).toMatch(/Not sent: Not a JPEG, PNG, WEBP image/);
    for (const name of ['e2e-board-top.jpg', 'e2e-board-bottom.jpg']) {
      const row = rows.filter({ hasText: name });
      await row.getByText('Stored').waitFor({ timeout: 60_000 });
      await expect.poll(() => row.getByTestId('upload-percent').textContent(), { timeout: 10_000 }).toBe('100 %');
      await expect.poll(() => row.getByRole('progressbar').getAttribute('aria-valuenow'), { timeout: 10_000 }).toBe('100');
    }
    await expect.poll(() => page.getByTestId('upload-overall').textContent(), { timeout: 10_000 }).toBe('100 %');

    // Both are in the gallery; open the first one on the stage.
    const list = (await (await page.request.get(`/api/teardowns/${teardownId}/photos`)).json()).photos as PhotoDto[];
    const uploaded = list.find((p) => p.name === 'e2e-board-top.jpg')!;
    expect(list.some((p) => p.name === 'e2e-board-bottom.jpg')).toBe(true);
    await page.getByTestId(`thumb-${uploaded.id}`).click();
    await page.waitForURL(new RegExp(`photo=${uploaded.id}`));

    // Click on the stage to place pin 1, label it (and link the part when there is one).
    const stage = page.getByTestId('photo-stage');
    // Wait for the stage to show the photo just opened (not the one shown before the click).
    await stage.locator(`img[src*="/api/photos/${uploaded.id}/"]`).waitFor();
    await stage.scrollIntoViewIfNeeded();
    const box = (await stage.boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.3, box.y + box.height * 0.4);
    await page.getByLabel('Label of pin 1').fill('Charger IC');
    if (part) await page.getByLabel('Part').selectOption(String(part.id));
    await page.getByRole('button', { name: 'Place pin' }).click();
    const pin = page.getByTestId('stage-pin-1');
    await pin.waitFor();

    const pinsOf = async () => (await (await page.request.get(`/api/photos/${uploaded.id}/callouts`)).json()).callouts as { x: number; y: number; label: string; part: { id: number } | null }[];
    const placed = (await pinsOf())[0]!;
    expect(placed.label).toBe('Charger IC');
    expect(placed.x).toBeCloseTo(0.3, 1);
    expect(placed.y).toBeCloseTo(0.4, 1);
    if (part) expect(placed.part?.id).toBe(part.id);

    // Drag it to the right and down.
    const p = (await pin.boundingBox())!;
    await page.mouse.move(p.x + p.width / 2, p.y + p.height / 2);
    await page.mouse.down();
    await page.mouse.move(p.x + p.width / 2 + box.width * 0.2, p.y + p.height / 2 + box.height * 0.2, { steps: 8 });
    const patched = page.waitForResponse((r) => r.url().includes('/api/callouts/') && r.request().method() === 'PATCH');
    await page.mouse.up();
    expect((await patched).status()).toBe(200);
    const moved = (await pinsOf())[0]!;
    expect(moved.x).toBeCloseTo(0.5, 1);
    expect(moved.y).toBeCloseTo(0.6, 1);

    // The pin shows on the filmstrip thumbnail of that photo.
    await page.getByTestId(`thumb-${uploaded.id}`).locator('g[data-pin="1"]').waitFor();
    await page.context().close();
  });

  it('a viewer sees published photos with pins but no upload or placing', async () => {
    const page = await signedInPage(browser, 'viewer');
    const teardownId = await teardownIdByModel(page, 'HandGlow Duo 10');
    await page.goto(`/teardowns/${teardownId}/photos`);
    await page.getByTestId('photo-stage').waitFor();
    await page.getByTestId('stage-pin-1').waitFor();
    await expect(page.getByTestId('photo-dropzone').count()).resolves.toBe(0);
    await expect(page.getByText('Click the photo to add one').count()).resolves.toBe(0);
    await page.context().close();
  });
});
