// The hostile-input corpus (tests/fixtures/hostile): every upload route is sent what an attacker
// or a careless user would send. Each case is refused with the standard error shape and a 4xx, or
// accepted in a neutralised form, and either way nothing is left behind: no row in the tables an
// upload writes, no file or folder under the uploads directory.
import { existsSync, readdirSync, statSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join, relative, resolve } from 'node:path';
import Papa from 'papaparse';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ErrorCode, PhotoDto } from '@splitcase/contracts';
import { readExifTags, TAG_GPS_POINTER } from '../support/exif';
import { signIn, streamUpload, type HttpSession } from '../support/http-client';
import { DEMO_PASSWORD, makeTestApp, type Agent, type TestApp } from '../support/test-app';
import {
  BOUNDARY,
  deepXml,
  fixture,
  formulaCells,
  garbledPartHeader,
  gpsJpeg,
  jpeg,
  logWithLongLine,
  noBoundary,
  oneLineLog,
  pixelBombPng,
  png,
  polyglotJpeg,
  truncatedForm,
  truncatedJpeg,
  zipLog,
} from '../fixtures/hostile/generate';

let t: TestApp;
let server: Server;
const as: Record<'engineer' | 'sourcing', Agent> = {} as never;
const http: Record<'engineer' | 'sourcing', HttpSession> = {} as never;
let draftId: number;
let publishedId: number;

const TABLES = ['photos', 'callouts', 'bench_runs', 'rate_tables', 'part_prices', 'parts', 'teardowns'] as const;

async function q<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  return (await t.orm.em.fork().getConnection().execute(sql, params)) as T[];
}

/** Every file and folder under the uploads directory, relative, sorted. */
function tree(dir: string, root = dir): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .flatMap((name) => {
      const path = join(dir, name);
      const rel = relative(root, path);
      return statSync(path).isDirectory() ? [`${rel}/`, ...tree(path, root)] : [rel];
    })
    .sort();
}

/** Rows of the tables an upload writes, the teardowns' status and version, and the upload tree. */
async function snapshot() {
  const rows: Record<string, number> = {};
  for (const table of TABLES) rows[table] = Number((await q<{ n: number }>(`select count(*) as n from ${table}`))[0]!.n);
  const teardowns = await q('select id, status, version from teardowns order by id');
  const rates = await q('select id from rate_tables order by id');
  return { rows, teardowns, rates, files: tree(t.env.uploadsDir) };
}

const raw = (a: Agent, path: string, form: { contentType: string; body: Buffer }) => a.agent.post(path).set('X-CSRF-Token', a.csrf).set('Content-Type', form.contentType).send(form.body);
const photo = (buffer: Buffer, filename: string, contentType = 'image/jpeg') => as.engineer.upload(`/api/teardowns/${draftId}/photos`).attach('file', buffer, { filename, contentType });
const dischargeMapping = JSON.stringify({ kind: 'discharge', time: { column: 'elapsed_s', unit: 's' }, voltage: { column: 'volts', unit: 'V' }, current: { column: 'amps', unit: 'A' } });
const runLog = (buffer: Buffer, filename = 'log.csv') =>
  as.engineer.upload(`/api/teardowns/${draftId}/runs`).field('mapping', dischargeMapping).attach('file', buffer, { filename, contentType: 'text/csv' });
const rates = (buffer: Buffer, filename = 'rates.xml') => as.sourcing.upload('/api/rates/import').attach('file', buffer, { filename, contentType: 'text/xml' });
const prices = (csv: string, mode: 'preview' | 'apply' = 'apply') =>
  as.sourcing.upload(`/api/teardowns/${publishedId}/prices/import?mode=${mode}`).attach('file', Buffer.from(csv), { filename: 'prices.csv', contentType: 'text/csv' });

const MB = 1024 * 1024;
const filePart = (filename: string, type: string) => `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="${filename}"\r\nContent-Type: ${type}\r\n\r\n`;
const mappingPart = `--${BOUNDARY}\r\nContent-Disposition: form-data; name="mapping"\r\n\r\n${dischargeMapping}\r\n`;

/** The costed-BOM export of the published teardown, parsed (the price import reads the same columns). */
async function costRows(): Promise<Record<string, string>[]> {
  const res = await as.sourcing
    .get(`/api/teardowns/${publishedId}/cost.csv?volume=1000`)
    .buffer(true)
    .parse((r, cb) => {
      let data = '';
      r.setEncoding('utf8');
      r.on('data', (c: string) => (data += c));
      r.on('end', () => cb(null, data));
    });
  expect(res.status).toBe(200);
  return Papa.parse<Record<string, string>>((res.body as string).replace(/^\uFEFF/, '').trim(), { header: true }).data;
}
const unparse = (rows: Record<string, string>[]) => Papa.unparse(rows, { newline: '\n' });
/** The export before a case changed prices, to put them back afterwards. */
let pricesBefore = '';

interface Sent {
  status: number;
  body: unknown;
}

interface Case {
  name: string;
  send: () => Promise<Sent>;
  status: 400 | 201 | 200 | 413 | 415 | 422;
  code?: ErrorCode;
  /** The key under error.fields that names the input. */
  field?: string;
  message?: RegExp;
  /** An input accepted in a safe form: check what was kept, then remove it (through the API). */
  neutralised?: (res: Sent) => Promise<void>;
}

/** Photo accepted: check it, then delete it so nothing is left. */
const keptPhoto = (check: (p: PhotoDto) => Promise<void> | void) => async (res: Sent) => {
  const p = (res.body as { photo: PhotoDto }).photo;
  const key = (await q<{ storage_key: string }>('select storage_key from photos where id = ?', [p.id]))[0]!.storage_key;
  // Stored under a random key, never under the client's name; nothing else in the photo folder but
  // the staging folder, empty between uploads.
  expect(key).toMatch(/^[a-f0-9]{32}$/);
  for (const folder of readdirSync(join(t.env.uploadsDir, 'photos'))) expect(folder).toMatch(/^([a-f0-9]{32}|\.incoming)$/);
  expect(readdirSync(join(t.env.uploadsDir, 'photos', '.incoming'))).toEqual([]);
  const ext = p.mime === 'image/png' ? 'png' : 'jpg';
  expect(readdirSync(join(t.env.uploadsDir, 'photos', key)).sort()).toEqual(['display.webp', `original.${ext}`, 'thumb.webp']);
  await check(p);
  await as.engineer.delete(`/api/photos/${p.id}`).expect(204);
};

const getFile = (url: string) =>
  as.engineer
    .get(url)
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    })
    .expect(200)
    .then((r) => r.body as Buffer);

const CASES: Case[] = [
  // ---- photos ------------------------------------------------------------------------------
  {
    name: 'photo: a JPEG cut short after its headers',
    send: async () => photo(await truncatedJpeg(), 'cut.jpg'),
    status: 422,
    code: 'unprocessable',
    field: 'file',
  },
  {
    name: 'photo: a pixel bomb (a PNG of a few dozen bytes declaring 900 megapixels)',
    send: async () => {
      const bomb = pixelBombPng();
      expect(bomb.length).toBeLessThan(200);
      return photo(bomb, 'bomb.png', 'image/png');
    },
    status: 422,
    code: 'unprocessable',
    field: 'file',
    message: /30000 × 30000 px.*100 megapixels/,
  },
  {
    name: 'photo: an SVG carrying a script',
    send: async () => photo(fixture('svg-with-script.svg'), 'board.svg', 'image/svg+xml'),
    status: 415,
    code: 'unsupported_media_type',
    field: 'file',
  },
  {
    name: 'photo: an SVG carrying a script, named and declared as a JPEG',
    send: async () => photo(fixture('svg-with-script.svg'), 'board.jpg'),
    status: 415,
    code: 'unsupported_media_type',
    field: 'file',
  },
  {
    name: 'photo: an HTML page renamed .jpg',
    send: async () => photo(fixture('html-renamed.jpg'), 'html-renamed.jpg'),
    status: 415,
    code: 'unsupported_media_type',
    field: 'file',
  },
  {
    name: 'photo: a text file named .jpg, whatever its declared type',
    send: async () => photo(Buffer.from('just some notes, not a picture\n'.repeat(20)), 'notes.jpg'),
    status: 415,
    code: 'unsupported_media_type',
    field: 'file',
  },
  {
    name: 'photo: a GIF named .jpg (the message says which types are accepted)',
    send: async () =>
      photo(
        await sharp({ create: { width: 10, height: 10, channels: 3, background: '#ff0000' } })
          .gif()
          .toBuffer(),
        'anim.jpg',
      ),
    status: 415,
    code: 'unsupported_media_type',
    message: /GIF.*JPEG, PNG, WebP/,
  },
  {
    name: 'photo: a JPEG with an HTML page and a script appended (polyglot) is re-encoded without it',
    send: async () => photo(await polyglotJpeg(), 'polyglot.jpg'),
    status: 201,
    neutralised: keptPhoto(async (p) => {
      for (const variant of ['original', 'display', 'thumb'] as const) {
        const file = await getFile(p.urls[variant]);
        expect(file.includes(Buffer.from('<script>')), variant).toBe(false);
      }
    }),
  },
  {
    name: 'photo: GPS and camera EXIF are removed from the original, the display image and the thumbnail',
    send: async () => {
      const input = await gpsJpeg();
      // The fixture really carries a GPS IFD and a camera make.
      const tags = readExifTags((await sharp(input).metadata()).exif!);
      expect(tags.ifd0).toContain(TAG_GPS_POINTER);
      expect(tags.gps.length).toBeGreaterThanOrEqual(4);
      expect(input.includes(Buffer.from('DemoCam'))).toBe(true);
      return photo(input, 'gps.jpg');
    },
    status: 201,
    neutralised: keptPhoto(async (p) => {
      for (const variant of ['original', 'display', 'thumb'] as const) {
        const file = await getFile(p.urls[variant]);
        const meta = await sharp(file).metadata();
        expect(meta.exif, variant).toBeUndefined();
        expect(meta.xmp, variant).toBeUndefined();
        expect(meta.iptc, variant).toBeUndefined();
        expect(file.includes(Buffer.from('Exif\0\0', 'latin1')), variant).toBe(false);
        expect(file.includes(Buffer.from('DemoCam')), variant).toBe(false);
        expect(file.includes(Buffer.from('Bench demo')), variant).toBe(false);
      }
    }),
  },
  {
    name: 'photo: a traversal name "../../etc/passwd.jpg" is kept only as the display name "passwd.jpg"',
    send: async () => photo(await jpeg(), '../../etc/passwd.jpg'),
    status: 201,
    neutralised: keptPhoto((p) => {
      expect(p.name).toBe('passwd.jpg');
      expect(existsSync(resolve(t.env.uploadsDir, '../../etc/passwd.jpg'))).toBe(false);
      expect(existsSync(resolve(t.env.uploadsDir, '../passwd.jpg'))).toBe(false);
    }),
  },
  {
    name: 'photo: a Windows traversal name "..\\..\\windows\\win.ini.png" becomes "win.ini.png"',
    send: async () => photo(await png(), '..\\..\\windows\\win.ini.png', 'image/png'),
    status: 201,
    neutralised: keptPhoto((p) => expect(p.name).toBe('win.ini.png')),
  },
  {
    name: 'photo: a name of dots "....png" becomes "png"',
    send: async () => photo(await png(), '....png', 'image/png'),
    status: 201,
    neutralised: keptPhoto((p) => expect(p.name).toBe('png')),
  },
  {
    name: 'photo: a NUL (U+0000) in the file name',
    send: async () => photo(await jpeg(), 'board\u0000.jpg'),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /control character/,
  },
  {
    name: "photo: a NUL in the file name, percent-encoded (filename*=UTF-8''…%00…)",
    send: async () =>
      raw(as.engineer, `/api/teardowns/${draftId}/photos`, {
        contentType: `multipart/form-data; boundary=${BOUNDARY}`,
        body: Buffer.concat([
          Buffer.from(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename*=UTF-8''board%00.jpg\r\nContent-Type: image/jpeg\r\n\r\n`),
          await jpeg(),
          Buffer.from(`\r\n--${BOUNDARY}--\r\n`),
        ]),
      }),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /control character/,
  },
  {
    name: 'photo: a file name of 20,000 characters (a part header over the parser limit)',
    send: async () => photo(await jpeg(), `${'a'.repeat(20_000)}.jpg`),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
  {
    name: 'photo: multipart/form-data without a boundary',
    send: async () => raw(as.engineer, `/api/teardowns/${draftId}/photos`, noBoundary()),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /not a well-formed multipart/,
  },
  {
    name: 'photo: a multipart body that stops in the middle of the file',
    send: async () => raw(as.engineer, `/api/teardowns/${draftId}/photos`, truncatedForm('board.jpg', (await jpeg()).subarray(0, 300), 'image/jpeg')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /not a well-formed multipart/,
  },
  {
    name: 'photo: a multipart part whose header is garbled',
    send: async () => raw(as.engineer, `/api/teardowns/${draftId}/photos`, garbledPartHeader()),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
  {
    name: 'photo: more form fields than the form has',
    send: async () => {
      let req = as.engineer.upload(`/api/teardowns/${draftId}/photos`);
      for (let k = 0; k < 12; k++) req = req.field(`extra${k}`, 'x');
      return req.attach('file', await jpeg(), 'a.jpg');
    },
    status: 400,
    code: 'validation_failed',
  },
  {
    name: 'photo: 300 MB announced in Content-Length is refused before the body is read',
    send: async () => {
      const res = await streamUpload(http.engineer, `/api/teardowns/${draftId}/photos`, { boundary: BOUNDARY, head: filePart('huge.jpg', 'image/jpeg'), fileBytes: 300 * MB });
      // The answer came long before the body: the limit refused it early.
      expect(res.complete).toBe(false);
      expect(res.sentBeforeAnswer).toBeLessThan(32 * MB);
      return res;
    },
    status: 413,
    code: 'payload_too_large',
    field: 'file',
  },
  {
    name: 'photo: 40 MB sent without a Content-Length (chunked) stops at the 25 MB limit',
    send: async () => streamUpload(http.engineer, `/api/teardowns/${draftId}/photos`, { boundary: BOUNDARY, head: filePart('huge.jpg', 'image/jpeg'), fileBytes: 40 * MB, chunked: true }),
    status: 413,
    code: 'payload_too_large',
  },

  // ---- bench-run logs ----------------------------------------------------------------------
  {
    name: 'run: a 1 MB log on one line (no line break) is refused at the line-length cap',
    send: async () => runLog(oneLineLog(MB)),
    status: 422,
    code: 'unprocessable',
    field: 'file',
    message: /Row 1 is longer than 64 KiB/,
  },
  {
    name: 'run: a good log whose fifth line is 200 KB long names that row',
    send: async () => runLog(logWithLongLine(200_000)),
    status: 422,
    code: 'unprocessable',
    field: 'file',
    message: /Row 5 is longer than 64 KiB/,
  },
  {
    name: 'run: a spreadsheet (zip container) uploaded as a log',
    send: async () => runLog(zipLog(), 'log.xlsx'),
    status: 422,
    code: 'unprocessable',
    field: 'file',
    message: /not a text file/,
  },
  {
    name: 'run: a NUL in the file name',
    send: async () => runLog(Buffer.from('elapsed_s,volts,amps\n0,4,1\n1,4,1\n'), 'log\u0000.csv'),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /control character/,
  },
  {
    name: 'run: a NUL in the file name, percent-encoded, leaves no file in the incoming folder',
    send: async () =>
      raw(as.engineer, `/api/teardowns/${draftId}/runs`, {
        contentType: `multipart/form-data; boundary=${BOUNDARY}`,
        body: Buffer.from(
          `${mappingPart}--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename*=UTF-8''log%00.csv\r\nContent-Type: text/csv\r\n\r\nelapsed_s,volts,amps\n0,4,1\n1,4,1\n\r\n--${BOUNDARY}--\r\n`,
        ),
      }),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /control character/,
  },
  {
    name: 'run: a multipart body that stops in the middle of the log leaves no partial file',
    send: async () =>
      raw(as.engineer, `/api/teardowns/${draftId}/runs`, {
        contentType: `multipart/form-data; boundary=${BOUNDARY}`,
        body: Buffer.concat([Buffer.from(mappingPart + filePart('log.csv', 'text/csv')), Buffer.from('elapsed_s,volts,amps\n0,4,1\n'.repeat(5000))]),
      }),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
  {
    name: 'run preview: a multipart body that stops in the middle of the log',
    send: async () => raw(as.engineer, `/api/teardowns/${draftId}/runs/preview`, truncatedForm('log.csv', Buffer.from('elapsed_s,volts\n0,4\n'), 'text/csv')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
  {
    name: 'run: 300 MB announced in Content-Length is refused before anything is written to disk',
    send: async () => {
      const res = await streamUpload(http.engineer, `/api/teardowns/${draftId}/runs`, { boundary: BOUNDARY, head: mappingPart + filePart('huge.csv', 'text/csv'), fileBytes: 300 * MB });
      expect(res.complete).toBe(false);
      expect(res.sentBeforeAnswer).toBeLessThan(32 * MB);
      return res;
    },
    status: 413,
    code: 'payload_too_large',
    field: 'file',
  },

  // ---- price and parts CSV -----------------------------------------------------------------
  {
    name: 'prices: a formula that starts like a number in the breaks column is refused, nothing saved',
    send: async () => {
      const rows = await costRows();
      const priced = rows.findIndex((r) => r.breaks);
      rows[priced]!.breaks = formulaCells().find((c) => c.startsWith('-'))!;
      return prices(unparse(rows));
    },
    status: 400,
    code: 'validation_failed',
    message: /nothing was saved/,
  },
  {
    name: 'prices: formula cells in the note column are saved as text and exported inert',
    send: async () => {
      const rows = await costRows();
      pricesBefore = unparse(rows.map((r) => ({ ...r })));
      // Payloads that start with = + @ (the leading-minus one is the cost.csv escaping rule, issue 11 item 9).
      const payloads = formulaCells().filter((c) => !c.startsWith('-'));
      const pricedRows = rows.map((r, k) => [r, k] as const).filter(([r]) => r.breaks);
      pricedRows.forEach(([r], k) => (r.note = payloads[k % payloads.length]!));
      return prices(unparse(rows));
    },
    status: 200,
    neutralised: async () => {
      const res = await as.sourcing.get(`/api/teardowns/${publishedId}/cost.csv?volume=1000`).buffer(true);
      const cells = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, '').trim()).data.flat();
      const payloads = formulaCells().filter((c) => !c.startsWith('-'));
      for (const payload of payloads.slice(0, 3)) expect(cells).toContain(`'${payload}`);
      for (const cell of cells) expect(cell, cell).not.toMatch(/^[=+@]/);
      // Put the notes back as they were.
      await prices(pricesBefore).expect(200);
      expect((await costRows()).map((r) => r.note)).toEqual(Papa.parse<Record<string, string>>(pricesBefore, { header: true }).data.map((r) => r.note));
    },
  },
  {
    name: 'prices: a JPEG uploaded as the price CSV',
    send: async () => as.sourcing.upload(`/api/teardowns/${publishedId}/prices/import?mode=apply`).attach('file', await jpeg(), 'prices.csv'),
    status: 400,
    code: 'validation_failed',
  },
  {
    name: 'prices: a multipart body that stops in the middle of the file',
    send: async () => raw(as.sourcing, `/api/teardowns/${publishedId}/prices/import?mode=apply`, truncatedForm('prices.csv', Buffer.from('designators,currency,breaks\nU1,USD,1@1\n'), 'text/csv')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
  {
    name: 'parts: formula cells in a parts CSV are kept as text and exported inert',
    send: async () => {
      const csv = Papa.unparse(
        formulaCells().map((c, k) => ({ Category: 'passive', Description: c, Quantity: 1, Notes: c, Designators: `R9${k}` })),
        { newline: '\n' },
      );
      return as.engineer.post(`/api/teardowns/${draftId}/parts/import`, { csv, mode: 'append' });
    },
    status: 200,
    neutralised: async (res) => {
      const parts = (res.body as { parts: { id: number; description: string }[] }).parts;
      expect(parts.map((p) => p.description)).toEqual(formulaCells());
      const csv = await as.engineer.get(`/api/teardowns/${draftId}/parts.csv`).buffer(true);
      const cells = Papa.parse<string[]>(csv.text.replace(/^\uFEFF/, '').trim()).data.flat();
      for (const payload of formulaCells()) expect(cells).toContain(`'${payload}`);
      for (const cell of cells) expect(cell, cell).not.toMatch(/^[=+\-@]/);
      for (const p of parts) await as.engineer.delete(`/api/parts/${p.id}`).expect(204);
    },
  },
  {
    name: 'parts: a quantity cell holding a formula is refused, nothing saved',
    send: async () => as.engineer.post(`/api/teardowns/${draftId}/parts/import`, { csv: `Category,Description,Quantity\npassive,Resistor,"${formulaCells()[0]!.replace(/"/g, '""')}"\n` }),
    status: 400,
    code: 'validation_failed',
  },
  {
    name: 'parts: an unterminated quote running to the end of the file',
    send: async () => as.engineer.post(`/api/teardowns/${draftId}/parts/import`, { csv: `Category,Description,Quantity\npassive,"Resistor,1\n${'x,'.repeat(20_000)}\n` }),
    status: 400,
    code: 'validation_failed',
  },
  {
    name: 'parts: a JSON body over the 1 MB request limit',
    send: async () => as.engineer.post(`/api/teardowns/${draftId}/parts/import`, { csv: `Category,Description\n${'passive,Resistor\n'.repeat(70_000)}` }),
    status: 413,
    code: 'payload_too_large',
  },
  // ---- the euro reference-rate XML ---------------------------------------------------------
  {
    name: 'rates: an external entity (XXE) reading a local file',
    send: async () => rates(fixture('external-entity.xml')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /DOCTYPE/,
  },
  {
    name: 'rates: a parameter entity pulling a remote DTD',
    send: async () => rates(fixture('parameter-entity.xml')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /DOCTYPE/,
  },
  {
    name: 'rates: billion laughs inside an otherwise valid rate file is refused, not stored',
    send: async () => rates(fixture('billion-laughs.xml')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /DOCTYPE/,
  },
  {
    name: 'rates: a valid rate file that carries a DOCTYPE is refused, not stored',
    send: async () => rates(fixture('doctype-rate-file.xml')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /DOCTYPE/,
  },
  {
    name: 'rates: 100,000 nested elements',
    send: async () => rates(deepXml(100_000)),
    status: 400,
    code: 'validation_failed',
    field: 'file',
    message: /nested/,
  },
  {
    name: 'rates: a PNG uploaded as the rate file',
    send: async () => rates(await png(), 'rates.xml'),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
  {
    name: 'rates: a multipart body that stops in the middle of the file',
    send: async () => raw(as.sourcing, '/api/rates/import', truncatedForm('rates.xml', fixture('doctype-rate-file.xml').subarray(0, 200), 'text/xml')),
    status: 400,
    code: 'validation_failed',
    field: 'file',
  },
];

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  as.engineer = await t.as('engineer');
  as.sourcing = await t.as('sourcing');
  const id = async (model: string) => (await q<{ id: number }>('select t.id from teardowns t join devices d on d.id = t.device_id where d.model = ?', [model]))[0]!.id;
  draftId = await id('Stackcell 20 PD');
  publishedId = await id('Stackcell 10');
  server = await new Promise<Server>((done) => {
    const s = t.app.listen(0, '127.0.0.1', () => done(s));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  http.engineer = await signIn(base, 'engineer@splitcase.test', DEMO_PASSWORD);
  http.sourcing = await signIn(base, 'sourcing@splitcase.test', DEMO_PASSWORD);
}, 120_000);
afterAll(async () => {
  server?.closeAllConnections();
  await new Promise((done) => server?.close(done));
  await t?.close();
});

describe('the hostile-input corpus', () => {
  it('has at least 25 cases', () => {
    expect(CASES.length).toBeGreaterThanOrEqual(25);
    expect(new Set(CASES.map((c) => c.name)).size).toBe(CASES.length);
  });

  for (const c of CASES) {
    it(
      c.name,
      async () => {
        const before = await snapshot();
        const res = await c.send();
        expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(c.status);
        if (c.status >= 400) {
          // The standard error shape, and nothing more (no stack, no driver message).
          const body = res.body as { error: { code: string; message: string; fields?: Record<string, string> } };
          expect(Object.keys(body)).toEqual(['error']);
          expect(typeof body.error.message).toBe('string');
          expect(Object.keys(body.error).every((k) => ['code', 'message', 'fields', 'details'].includes(k))).toBe(true);
          expect(JSON.stringify(body)).not.toMatch(/\bat .*\.(ts|js):\d+/);
          if (c.code) expect(body.error.code).toBe(c.code);
          if (c.field) expect(body.error.fields, JSON.stringify(body.error)).toHaveProperty([c.field]);
          if (c.message) expect(body.error.message + ' ' + JSON.stringify(body.error.fields ?? {})).toMatch(c.message);
        }
        await c.neutralised?.(res);
        const after = await snapshot();
        if (!c.neutralised) {
          expect(after).toEqual(before);
        } else {
          // Whatever was kept has been removed again: the same rows and files as before.
          expect(after.rows).toEqual(before.rows);
          expect(after.files).toEqual(before.files);
        }
      },
      60_000,
    );
  }
});
