import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import exifr from 'exifr';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';

let server: Awaited<ReturnType<typeof startTestServer>>;
let author: Awaited<ReturnType<typeof signIn>>;
let resultId: number;

const goodInput = () => ({
  steel: 'aisi-a2',
  hardness: { value: 60, scale: 'HRC' },
  abrasive: 'cbn-resin-wheel-250-b46',
  edgeAngle: { perSideDeg: 13 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [150, 155, 149, 160, 152] },
});

/** A JPEG carrying camera EXIF and a GPS position (51° 30′ N, 0° 7′ W), made with sharp. */
async function jpegWithGps(width = 640, height = 480): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 180, g: 120, b: 60 } } })
    .jpeg()
    .withExif({
      IFD0: { Make: 'Edgeledger test camera', Model: 'T1' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    })
    .toBuffer();
}

const upload = (id: number, file: Buffer, filename: string, alt = 'Edge at 100× under the microscope', who = author) =>
  who.agent.post(`/api/results/${id}/photos`).set('X-CSRF-Token', who.csrf).field('alt', alt).attach('photo', file, { filename, contentType: 'image/jpeg' });

const tmpFiles = () => new Set(fs.readdirSync(os.tmpdir()));

beforeAll(async () => {
  server = await startTestServer();
  author = await signIn(server.url, await demoHandle(server.url, 'member'));
  resultId = (await author.agent.post('/api/results').set('X-CSRF-Token', author.csrf).send(goodInput()).expect(201)).body.id;
});
afterAll(async () => {
  await server?.stop();
});

describe('photos of a result', () => {
  it('re-encodes the upload so that its EXIF, GPS included, is gone (read back with exifr)', async () => {
    const original = await jpegWithGps();
    // The test image really carries a position before upload.
    expect(await exifr.gps(original)).toMatchObject({ latitude: 51.5 });

    const res = await upload(resultId, original, 'IMG_0001 holiday.jpg').expect(201);
    expect(res.body).toMatchObject({ id: expect.any(Number), url: `/api/v1/photos/${res.body.id}`, thumbUrl: `/api/v1/photos/${res.body.id}/thumb`, alt: 'Edge at 100× under the microscope' });

    const image = await author.agent.get(res.body.url).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    const served = image.body as Buffer;
    expect(await exifr.gps(served)).toBeUndefined();
    expect(await exifr.parse(served, true)).toBeUndefined();
    expect((await sharp(served).metadata()).width).toBe(640);

    const thumb = await author.agent.get(res.body.thumbUrl).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect((await sharp(thumb.body as Buffer).metadata()).width).toBeLessThanOrEqual(400);

    // Stored through the S3 API under a generated name, never the client's.
    const stored = fs.readdirSync(path.join(server.dataDir, 's3'), { recursive: true }).map(String);
    expect(stored.some((f) => /results\/\d+\/[0-9a-f-]{36}\.jpg/.test(f))).toBe(true);
    expect(stored.some((f) => f.includes('holiday') || f.includes('IMG_0001'))).toBe(false);
  });

  it('refuses a renamed non-image and an SVG by their content', async () => {
    const text = await upload(resultId, Buffer.from('steel,hardness\naisi-d2,61\n'), 'photo.jpg').expect(415);
    expect(text.body.error).toMatch(/not a JPEG, PNG, WebP or TIFF image/);
    expect(text.body.issues[0].path).toBe('photo');
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script></svg>');
    await upload(resultId, svg, 'edge.jpg').expect(415);
    // A JPEG signature in front of junk is caught by the decoder.
    await upload(resultId, Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(2000, 7)]), 'x.jpg').expect(415);
  });

  it('refuses a file over 8 MB with 413 and a clear message, leaving no temporary file', async () => {
    const before = tmpFiles();
    const big = Buffer.concat([await jpegWithGps(), Buffer.alloc(8 * 1024 * 1024 + 10, 1)]);
    const res = await upload(resultId, big, 'big.jpg').expect(413);
    expect(res.body.error).toMatch(/larger than 8 MB/);
    const added = [...tmpFiles()].filter((f) => !before.has(f) && !f.startsWith('edgeledger-'));
    expect(added).toEqual([]);
  });

  it('asks for alt text', async () => {
    const res = await upload(resultId, await jpegWithGps(64, 48), 'a.jpg', '').expect(400);
    expect(res.body.issues[0].path).toBe('alt');
  });

  it('lets only the author upload, and hides an unpublished result’s photos from others', async () => {
    const other = await signIn(server.url, await demoHandle(server.url, 'member', 1));
    await upload(resultId, await jpegWithGps(64, 48), 'a.jpg', 'alt text here', other).expect(404);
    await request(server.url).post(`/api/results/${resultId}/photos`).field('alt', 'x').attach('photo', Buffer.from('x'), 'a.jpg').expect(401);
    const list = await author.agent.get(`/api/results/${resultId}/photos`).expect(200);
    expect(list.body.items.length).toBeGreaterThan(0);
    await request(server.url).get(list.body.items[0].url).expect(404);
    await request(server.url).get(`/api/results/${resultId}/photos`).expect(404);
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    await mod.agent.get(list.body.items[0].url).expect(200);
  });

  it('keeps at most 6 photos per result', async () => {
    const id = (await author.agent.post('/api/results').set('X-CSRF-Token', author.csrf).send(goodInput()).expect(201)).body.id;
    const small = await jpegWithGps(64, 48);
    for (let i = 0; i < 6; i += 1) await upload(id, small, `p${i}.jpg`).expect(201);
    const seventh = await upload(id, small, 'p7.jpg').expect(409);
    expect(seventh.body.error).toMatch(/at most 6 photos/);
    const list = await author.agent.get(`/api/results/${id}/photos`).expect(200);
    await author.agent.delete(list.body.items[0].url).set('X-CSRF-Token', author.csrf).expect(204);
    await upload(id, small, 'p8.jpg').expect(201);
  });
});
