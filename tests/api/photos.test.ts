import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { CONFIRM_UNPUBLISH_HEADER, type PhotoDto } from '@splitcase/contracts';
import { fileOps } from '../../apps/api/src/modules/photos/photo-files';
import { matchPart } from '../../apps/api/src/seed/photos';
import { DEMO_DEVICES } from '../../apps/api/src/seed/scenario';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

// ---- fixtures, generated here with sharp ----------------------------------------------------

const solid = (width: number, height: number, background: string) => sharp({ create: { width, height, channels: 3, background } });
const jpegFixture = (w = 64, h = 48) => solid(w, h, '#3d7a4a').jpeg().toBuffer();
const pngFixture = (w = 64, h = 48) => solid(w, h, '#c2703d').png().toBuffer();

/** 40 × 20 px stored, left half red and right half blue, tagged EXIF orientation 6 (rotate 90° clockwise to view). */
async function orientation6Jpeg() {
  const left = await solid(20, 20, '#ff0000').png().toBuffer();
  return solid(40, 20, '#0000ff')
    .composite([{ input: left, left: 0, top: 0 }])
    .jpeg({ quality: 95 })
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

/** Random noise compresses badly: a JPEG of about `kb` kilobytes. */
async function bigJpeg(side: number) {
  const raw = Buffer.alloc(side * side * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 2654435761) >>> 24;
  return sharp(raw, { raw: { width: side, height: side, channels: 3 } })
    .jpeg({ quality: 95 })
    .toBuffer();
}

// ---- helpers ---------------------------------------------------------------------------------

let t: TestApp;
let engineer: Agent;

async function teardownIdOf(app: TestApp, model: string): Promise<number> {
  const rows = (await app.orm.em.fork().getConnection().execute('select t.id from teardowns t join devices d on d.id = t.device_id where d.model = ?', [model])) as { id: number }[];
  if (!rows[0]) throw new Error(`No demo teardown for ${model}`);
  return rows[0].id;
}

async function insertPart(app: TestApp, teardownId: number, description: string, category = 'ic'): Promise<number> {
  const conn = app.orm.em.fork().getConnection();
  const now = new Date().toISOString();
  await conn.execute('insert into parts (teardown_id, position, category, description, quantity, mount, created_at, updated_at) values (?, 0, ?, ?, 1, ?, ?, ?)', [
    teardownId,
    category,
    description,
    'smt',
    now,
    now,
  ]);
  const rows = (await conn.execute('select max(id) as id from parts')) as { id: number }[];
  return rows[0]!.id;
}

const uploadAs = (agent: Agent, teardownId: number, buffer: Buffer, filename: string, contentType = 'image/jpeg') =>
  agent.upload(`/api/teardowns/${teardownId}/photos`).attach('file', buffer, { filename, contentType });

const binary = (res: { body: unknown }) => res.body as Buffer;
const getFile = (agent: Agent, url: string) =>
  agent
    .get(url)
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });

const photoDir = (app: TestApp) => join(app.env.uploadsDir, 'photos');
const storageFolders = (app: TestApp) => (existsSync(photoDir(app)) ? readdirSync(photoDir(app)) : []);

let draftId: number;
let otherDraftId: number;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  engineer = await t.as('engineer');
  draftId = await teardownIdOf(t, 'Stackcell 20 PD');
  otherDraftId = await teardownIdOf(t, 'Trailbeam C3');
}, 120_000);
afterAll(() => t?.close());

describe('upload', () => {
  it('stores a JPEG and a PNG with thumbnail and display image under random names', async () => {
    const jpg = await uploadAs(engineer, draftId, await jpegFixture(2400, 1800), 'board top.jpg')
      .field('caption', 'Main board, top')
      .field('layer', '7')
      .expect(201);
    const photo = jpg.body.photo as PhotoDto;
    expect(photo).toMatchObject({ teardownId: draftId, name: 'board top.jpg', mime: 'image/jpeg', width: 2400, height: 1800, caption: 'Main board, top', layer: 7, step: 1 });
    expect(photo.urls.thumb).toBe(`/api/photos/${photo.id}/thumb`);

    const thumb = await getFile(engineer, photo.urls.thumb).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect(thumb.headers['x-content-type-options']).toBe('nosniff');
    expect(thumb.headers['cache-control']).toMatch(/private/);
    const thumbMeta = await sharp(binary(thumb)).metadata();
    expect([thumbMeta.format, thumbMeta.width, thumbMeta.height]).toEqual(['webp', 320, 240]);
    const display = await sharp(binary(await getFile(engineer, photo.urls.display).expect(200))).metadata();
    expect([display.format, display.width, display.height]).toEqual(['webp', 1600, 1200]);
    const original = await getFile(engineer, photo.urls.original).expect(200);
    expect(original.headers['content-type']).toBe('image/jpeg');
    expect((await sharp(binary(original)).metadata()).width).toBe(2400);

    const png = await uploadAs(engineer, draftId, await pngFixture(), 'cell-pack.png', 'image/png')
      .field('layer', '7')
      .expect(201);
    expect(png.body.photo).toMatchObject({ mime: 'image/png', width: 64, height: 48, layer: 7, step: 2 });
    // A small image is not enlarged.
    const pngThumb = await sharp(binary(await getFile(engineer, png.body.photo.urls.thumb).expect(200))).metadata();
    expect([pngThumb.width, pngThumb.height]).toEqual([64, 48]);

    const list = await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200);
    expect(list.body.photos.map((p: PhotoDto) => p.id)).toEqual(expect.arrayContaining([photo.id, png.body.photo.id]));
    expect(list.body.limits.maxBytes).toBe(25 * 1024 * 1024);
    expect(list.body.limits.types.map((x: { mime: string }) => x.mime)).toEqual(expect.arrayContaining(['image/jpeg', 'image/png', 'image/webp']));

    // Every folder is a 32-hex random key holding exactly the three files.
    const row = (await t.orm.em.fork().getConnection().execute('select storage_key from photos where id = ?', [photo.id])) as { storage_key: string }[];
    expect(row[0]!.storage_key).toMatch(/^[a-f0-9]{32}$/);
    expect(readdirSync(join(photoDir(t), row[0]!.storage_key)).sort()).toEqual(['display.webp', 'original.jpg', 'thumb.webp']);
  });

  it('accepts WebP, and photos are ordered by layer then step', async () => {
    const webp = await solid(50, 50, '#4fa89f').webp().toBuffer();
    const res = await uploadAs(engineer, otherDraftId, webp, 'x.webp', 'image/webp').field('layer', '1').field('step', '5').expect(201);
    expect(res.body.photo.mime).toBe('image/webp');
    await uploadAs(engineer, otherDraftId, await jpegFixture(), 'a.jpg')
      .field('layer', '1')
      .field('step', '2')
      .expect(201);
    await uploadAs(engineer, otherDraftId, await jpegFixture(), 'b.jpg')
      .field('layer', '0')
      .expect(400);
    const list = (await engineer.get(`/api/teardowns/${otherDraftId}/photos`).expect(200)).body.photos as PhotoDto[];
    const order = list.map((p) => [p.layer, p.step]);
    expect(order).toEqual([...order].sort((a, b) => a[0]! - b[0]! || a[1]! - b[1]!));
  });

  it('turns an image upright from its EXIF orientation (6: 90° clockwise)', async () => {
    const input = await orientation6Jpeg();
    expect((await sharp(input).metadata()).orientation).toBe(6);
    const res = await uploadAs(engineer, draftId, input, 'sideways.jpg').expect(201);
    expect([res.body.photo.width, res.body.photo.height]).toEqual([20, 40]);
    for (const variant of ['original', 'display'] as const) {
      const file = binary(await getFile(engineer, res.body.photo.urls[variant]).expect(200));
      const meta = await sharp(file).metadata();
      expect(meta.orientation ?? 1).toBe(1);
      const { data, info } = await sharp(file).raw().toBuffer({ resolveWithObject: true });
      expect([info.width, info.height]).toEqual([20, 40]);
      const px = (x: number, y: number) => [...data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3)];
      // The stored left half (red) is now the top; the right half (blue) the bottom.
      expect(px(10, 5)[0]).toBeGreaterThan(200);
      expect(px(10, 5)[2]).toBeLessThan(60);
      expect(px(10, 35)[2]).toBeGreaterThan(200);
      expect(px(10, 35)[0]).toBeLessThan(60);
    }
  });
});

// Hostile uploads (wrong types, pixel bombs, cut files, traversal names, GPS EXIF, malformed bodies)
// are the table-driven corpus of tests/api/hostile-input.test.ts.
describe('upload refusals', () => {
  it('answers 400 naming the field when no file is sent, or under another field name', async () => {
    const none = await engineer.upload(`/api/teardowns/${draftId}/photos`).field('caption', 'x').expect(400);
    expect(none.body.error.fields).toHaveProperty('file');
    await engineer
      .upload(`/api/teardowns/${draftId}/photos`)
      .attach('photo', await jpegFixture(), 'a.jpg')
      .expect(400);
  });

  it('keeps nothing when a derivative cannot be written', async () => {
    const before = storageFolders(t).sort();
    const photosBefore = (await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200)).body.photos.length;
    const real = fileOps.writeFile;
    const spy = vi.spyOn(fileOps, 'writeFile').mockImplementation(async (path, data, opts) => {
      if (String(path).endsWith('display.webp')) throw Object.assign(new Error('disk full (simulated)'), { code: 'ENOSPC' });
      return real(path, data, opts);
    });
    try {
      const res = await uploadAs(engineer, draftId, await jpegFixture(), 'full-disk.jpg');
      expect(res.status).toBe(500);
      // The error and its stack go to the request's log line (tests/api/logging.test.ts), never into the answer.
      expect(res.body.error.code).toBe('internal');
      expect(JSON.stringify(res.body)).not.toMatch(/disk full|ENOSPC|at .*\.ts/);
    } finally {
      spy.mockRestore();
    }
    expect(storageFolders(t).sort()).toEqual(before);
    expect((await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200)).body.photos.length).toBe(photosBefore);
  });

  it('keeps nothing when the files cannot be moved into place after the row is committed', async () => {
    const before = storageFolders(t).sort();
    const photosBefore = (await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200)).body.photos.length;
    const [audit] = (await t.orm.em.fork().getConnection().execute("select count(*) as n from audit_entries where action = 'photo.uploaded'")) as { n: number }[];
    const spy = vi.spyOn(fileOps, 'rename').mockRejectedValue(Object.assign(new Error('permission denied (simulated)'), { code: 'EACCES' }));
    const log = vi.spyOn(t.deps, 'log').mockImplementation(() => {});
    try {
      const res = await uploadAs(engineer, draftId, await jpegFixture(), 'unmovable.jpg');
      expect(res.status).toBe(500);
    } finally {
      spy.mockRestore();
      log.mockRestore();
    }
    expect(storageFolders(t).sort()).toEqual(before);
    expect(readdirSync(join(photoDir(t), '.incoming'))).toEqual([]);
    expect((await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200)).body.photos.length).toBe(photosBefore);
    const [auditAfter] = (await t.orm.em.fork().getConnection().execute("select count(*) as n from audit_entries where action = 'photo.uploaded'")) as { n: number }[];
    expect(auditAfter!.n).toBe(audit!.n);
  });

  it('refuses a file over the configured size limit with 413', async () => {
    const small = await makeTestApp({ seed: 'demo', env: { uploadMaxBytes: 20_000 } });
    try {
      const eng = await small.as('engineer');
      const id = await teardownIdOf(small, 'Stackcell 20 PD');
      const big = await bigJpeg(200);
      expect(big.length).toBeGreaterThan(20_000);
      const res = await uploadAs(eng, id, big, 'big.jpg').expect(413);
      expect(res.body.error.code).toBe('payload_too_large');
      const limits = (await eng.get(`/api/teardowns/${id}/photos`).expect(200)).body.limits;
      expect(limits.maxBytes).toBe(20_000);
      await uploadAs(eng, id, await jpegFixture(), 'ok.jpg').expect(201);
    } finally {
      await small.close();
    }
  });
});

describe('who may upload and see', () => {
  it('lets only engineers and admins upload; others get 403, anonymous 401', async () => {
    const file = await jpegFixture();
    for (const role of ['sourcing', 'lead', 'viewer']) {
      const agent = await t.as(role);
      const published = await teardownIdOf(t, 'Stackcell 10');
      await uploadAs(agent, published, file, 'x.jpg').expect(403);
    }
    await uploadAs(await t.as('admin'), draftId, file, 'admin.jpg').expect(201);
    await uploadAs(await t.anonymous(), draftId, file, 'x.jpg').expect(401);
  });

  it('hides a draft teardown’s photos from viewers (404) and serves published ones', async () => {
    const draftPhoto = (await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200)).body.photos[0] as PhotoDto;
    const viewer = await t.as('viewer');
    await viewer.get(`/api/teardowns/${draftId}/photos`).expect(404);
    await viewer.get(draftPhoto.urls.thumb).expect(404);
    await viewer.get(draftPhoto.urls.original).expect(404);
    await viewer.get(`/api/photos/${draftPhoto.id}/callouts`).expect(404);
    await (await t.anonymous()).get(draftPhoto.urls.thumb).expect(401);
    await engineer.get(`/api/photos/${draftPhoto.id}/poster`).expect(400);

    const publishedId = await teardownIdOf(t, 'HandGlow Duo 10');
    const published = (await viewer.get(`/api/teardowns/${publishedId}/photos`).expect(200)).body.photos as PhotoDto[];
    expect(published.length).toBeGreaterThanOrEqual(2);
    const thumb = await getFile(viewer, published[0]!.urls.thumb).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
  });

  it('asks for confirmation before changing a published teardown, then moves it back to draft', async () => {
    const id = await teardownIdOf(t, 'Slimvolt 5');
    const refused = await uploadAs(engineer, id, await jpegFixture(), 'x.jpg').expect(409);
    expect(refused.body.error.details).toEqual({ reason: 'published' });
    await uploadAs(engineer, id, await jpegFixture(), 'x.jpg')
      .set(CONFIRM_UNPUBLISH_HEADER, 'yes')
      .expect(201);
    expect((await engineer.get(`/api/teardowns/${id}`).expect(200)).body.teardown.status).toBe('draft');
  });
});

describe('caption, layer, step and delete', () => {
  it('edits the caption, layer and step, validates them, and records the change', async () => {
    const photo = (
      await uploadAs(engineer, draftId, await jpegFixture(), 'edit-me.jpg')
        .field('layer', '2')
        .field('step', '9')
        .expect(201)
    ).body.photo as PhotoDto;
    const res = await engineer.patch(`/api/photos/${photo.id}`, { caption: '  Charger IC and inductor  ', layer: 3, step: 4 }).expect(200);
    expect(res.body.photo).toMatchObject({ caption: 'Charger IC and inductor', layer: 3, step: 4 });
    const cleared = await engineer.patch(`/api/photos/${photo.id}`, { caption: '' }).expect(200);
    expect(cleared.body.photo.caption).toBeNull();

    const bad = await engineer.patch(`/api/photos/${photo.id}`, { layer: 1.5, caption: 'x'.repeat(501) }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['caption', 'layer']);
    await engineer.patch(`/api/photos/${photo.id}`, {}).expect(400);
    await (await t.as('lead')).patch(`/api/photos/${photo.id}`, { caption: 'x' }).expect(403);

    const audit = (await t.orm.em
      .fork()
      .getConnection()
      .execute("select summary from audit_entries where action = 'photo.updated' and entity_id = ?", [String(photo.id)])) as { summary: string }[];
    expect(audit[0]!.summary).toMatch(/caption, layer, step/);
  });

  it('deletes a photo with its pins and its files', async () => {
    const photo = (await uploadAs(engineer, draftId, await jpegFixture(), 'gone.jpg').expect(201)).body.photo as PhotoDto;
    const pin = (await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.5, y: 0.5, label: 'Temporary' }).expect(201)).body.callout;
    const key = ((await t.orm.em.fork().getConnection().execute('select storage_key from photos where id = ?', [photo.id])) as { storage_key: string }[])[0]!.storage_key;
    expect(existsSync(join(photoDir(t), key))).toBe(true);
    await (await t.as('sourcing')).delete(`/api/photos/${photo.id}`).expect(403);
    await engineer.delete(`/api/photos/${photo.id}`).expect(204);
    expect(existsSync(join(photoDir(t), key))).toBe(false);
    await engineer.get(photo.urls.thumb).expect(404);
    await engineer.patch(`/api/callouts/${pin.id}`, { label: 'x' }).expect(404);
    await engineer.delete(`/api/photos/${photo.id}`).expect(404);
  });
});

describe('callouts', () => {
  let photo: PhotoDto;
  let partId: number;
  let foreignPartId: number;

  beforeAll(async () => {
    photo = (await uploadAs(engineer, draftId, await jpegFixture(800, 600), 'pins.jpg').expect(201)).body.photo;
    partId = await insertPart(t, draftId, 'Buck-boost charger IC (demo)');
    foreignPartId = await insertPart(t, otherDraftId, 'Ballast resistor (demo)', 'passive');
  });

  it('places numbered pins, links a part, moves, relabels and removes them', async () => {
    const one = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.25, y: 0.4, label: 'Charger IC', partId }).expect(201);
    expect(one.body.callout).toMatchObject({ photoId: photo.id, number: 1, x: 0.25, y: 0.4, label: 'Charger IC', part: { id: partId } });
    expect(one.body.callout.part.label).toMatch(/Buck-boost charger IC/);
    const two = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 1, y: 0, label: 'Corner' }).expect(201);
    expect(two.body.callout.number).toBe(2);

    const moved = await engineer.patch(`/api/callouts/${two.body.callout.id}`, { x: 0.6, y: 0.7, label: 'Inductor' }).expect(200);
    expect(moved.body.callout).toMatchObject({ x: 0.6, y: 0.7, label: 'Inductor', number: 2, part: null });
    const unlinked = await engineer.patch(`/api/callouts/${one.body.callout.id}`, { partId: null }).expect(200);
    expect(unlinked.body.callout.part).toBeNull();
    await engineer.patch(`/api/callouts/${one.body.callout.id}`, { partId }).expect(200);

    const listed = await engineer.get(`/api/photos/${photo.id}/callouts`).expect(200);
    expect(listed.body.callouts.map((c: { number: number }) => c.number)).toEqual([1, 2]);
    const inGallery = (await engineer.get(`/api/teardowns/${draftId}/photos`).expect(200)).body.photos.find((p: PhotoDto) => p.id === photo.id);
    expect(inGallery.callouts).toHaveLength(2);

    await engineer.delete(`/api/callouts/${two.body.callout.id}`).expect(204);
    // Numbers of removed pins are not reused: the next is one after the highest.
    const three = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.1, y: 0.1, label: 'Test pad' }).expect(201);
    expect(three.body.callout.number).toBe(2);
    const four = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.2, y: 0.1, label: 'Test pad 2' }).expect(201);
    expect(four.body.callout.number).toBe(3);
  });

  it('refuses positions outside 0..1, naming x or y', async () => {
    const res = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 1.2, y: 0.5, label: 'Off the edge' }).expect(400);
    expect(res.body.error.fields).toEqual({ x: 'x must be between 0 and 1' });
    const neg = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.5, y: -0.01, label: 'Above' }).expect(400);
    expect(neg.body.error.fields).toHaveProperty('y');
    const noLabel = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.5, y: 0.5, label: '  ' }).expect(400);
    expect(noLabel.body.error.fields).toHaveProperty('label');
    const text = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: '0.5', y: 0.5, label: 'String' }).expect(400);
    expect(text.body.error.fields).toHaveProperty('x');
    const c = (await engineer.get(`/api/photos/${photo.id}/callouts`).expect(200)).body.callouts[0];
    await engineer.patch(`/api/callouts/${c.id}`, { y: 2 }).expect(400);
  });

  it('refuses a part or finding of another teardown, naming the field', async () => {
    const res = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.5, y: 0.5, label: 'Wrong part', partId: foreignPartId }).expect(400);
    expect(res.body.error.fields).toEqual({ partId: 'This part belongs to another teardown' });
    const missing = await engineer.post(`/api/photos/${photo.id}/callouts`, { x: 0.5, y: 0.5, label: 'No such', findingId: 999_999 }).expect(400);
    expect(missing.body.error.fields).toHaveProperty('findingId');
    const c = (await engineer.get(`/api/photos/${photo.id}/callouts`).expect(200)).body.callouts[0];
    await engineer.patch(`/api/callouts/${c.id}`, { partId: foreignPartId }).expect(400);
  });

  it('lets only editors change pins', async () => {
    const c = (await engineer.get(`/api/photos/${photo.id}/callouts`).expect(200)).body.callouts[0];
    for (const role of ['sourcing', 'lead']) {
      const agent = await t.as(role);
      await agent.get(`/api/photos/${photo.id}/callouts`).expect(200);
      await agent.post(`/api/photos/${photo.id}/callouts`, { x: 0.5, y: 0.5, label: 'x' }).expect(403);
      await agent.patch(`/api/callouts/${c.id}`, { label: 'x' }).expect(403);
      await agent.delete(`/api/callouts/${c.id}`).expect(403);
    }
    await (await t.as('viewer')).delete(`/api/callouts/${c.id}`).expect(403);
  });

  it('lists the pins of a part with their photos, and the link targets', async () => {
    const forPart = await engineer.get(`/api/teardowns/${draftId}/callouts?partId=${partId}`).expect(200);
    expect(forPart.body.callouts).toHaveLength(1);
    expect(forPart.body.callouts[0]).toMatchObject({ label: 'Charger IC', part: { id: partId }, photo: { id: photo.id, urls: { thumb: `/api/photos/${photo.id}/thumb` } } });
    const none = await engineer.get(`/api/teardowns/${draftId}/callouts?partId=${foreignPartId}`).expect(200);
    expect(none.body.callouts).toEqual([]);
    const all = await engineer.get(`/api/teardowns/${draftId}/callouts`).expect(200);
    expect(all.body.callouts.length).toBeGreaterThanOrEqual(3);
    await engineer.get(`/api/teardowns/${draftId}/callouts?partId=abc`).expect(400);

    const targets = await engineer.get(`/api/teardowns/${draftId}/callout-targets`).expect(200);
    expect(targets.body.parts).toEqual(expect.arrayContaining([{ id: partId, label: 'Buck-boost charger IC (demo)' }]));
    expect(targets.body.parts.find((p: { id: number }) => p.id === foreignPartId)).toBeUndefined();
    await (await t.as('viewer')).get(`/api/teardowns/${draftId}/callout-targets`).expect(404);
  });
});

describe('demo photos', () => {
  it('gives every demo teardown 2–4 processed illustrations with pins inside the picture', async () => {
    const conn = t.orm.em.fork().getConnection();
    const perTeardown = (await conn.execute("select teardown_id, count(*) as n from photos where original_name like 'demo-%' group by teardown_id")) as { teardown_id: number; n: number }[];
    expect(perTeardown).toHaveLength(DEMO_DEVICES.length);
    for (const row of perTeardown) {
      expect(row.n).toBeGreaterThanOrEqual(2);
      expect(row.n).toBeLessThanOrEqual(4);
    }
    const pins = (await conn.execute("select c.x, c.y, c.label, c.number from callouts c join photos p on p.id = c.photo_id where p.original_name like 'demo-%'")) as {
      x: number;
      y: number;
      label: string;
    }[];
    expect(pins.length).toBeGreaterThan(DEMO_DEVICES.length * 6);
    for (const pin of pins) {
      expect(pin.x).toBeGreaterThanOrEqual(0);
      expect(pin.x).toBeLessThanOrEqual(1);
      expect(pin.y).toBeGreaterThanOrEqual(0);
      expect(pin.y).toBeLessThanOrEqual(1);
      expect(pin.label.length).toBeGreaterThan(0);
    }
    // Pins that name a charger point at a charger part, never at the protection IC beside it.
    const chargerPins = (await conn.execute(
      "select c.label, pa.description from callouts c join photos p on p.id = c.photo_id join parts pa on pa.id = c.part_id where p.original_name like 'demo-%' and c.label like '%charger%'",
    )) as { label: string; description: string }[];
    expect(chargerPins.length).toBeGreaterThan(0);
    for (const pin of chargerPins) expect(pin.description, pin.label).not.toMatch(/protection/i);
    // Stored through the upload path: random folder, the three files, no metadata.
    const demo = (await conn.execute("select id, storage_key from photos where original_name like 'demo-halvix-duo-%' order by id limit 1")) as { id: number; storage_key: string }[];
    expect(readdirSync(join(photoDir(t), demo[0]!.storage_key)).sort()).toEqual(['display.webp', 'original.jpg', 'thumb.webp']);
    const original = binary(await getFile(engineer, `/api/photos/${demo[0]!.id}/original`).expect(200));
    expect((await sharp(original).metadata()).exif).toBeUndefined();
  });

  it('links a pin to the part of the same category whose description matches', () => {
    const part = (id: number, category: string, description: string) => ({ id, category, description, marking: null }) as never;
    const parts = [part(1, 'ic', '8-bit microcontroller'), part(2, 'ic', 'Buck-boost charger IC'), part(3, 'heater', 'Flexible heater A')];
    expect(matchPart(parts, { x: 0, y: 0, label: 'Charger', match: { category: 'ic', pattern: /charg|boost/i } })).toMatchObject({ id: 2 });
    expect(matchPart(parts, { x: 0, y: 0, label: 'Heater', match: { category: 'heater' } })).toMatchObject({ id: 3 });
    expect(matchPart(parts, { x: 0, y: 0, label: 'Protection', match: { category: 'ic', pattern: /protect/i } })).toBeNull();
    expect(matchPart(parts, { x: 0, y: 0, label: 'Sensor', match: { category: 'sensor' } })).toBeNull();
    expect(matchPart([], { x: 0, y: 0, label: 'Anything', match: { category: 'ic' } })).toBeNull();
    expect(matchPart(parts, { x: 0, y: 0, label: 'No match wanted' })).toBeNull();
  });
});
