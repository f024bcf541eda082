import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { ImportBatch, Result, ResultEvent } from '../../server/models';
import fc from 'fast-check';
import { IMPORT_COLUMNS, mapHeader, plainToRichText, rowToResultInput } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';
import { plainParagraphsHtml, renderWithTipTap } from '../../server/rich-text/render';

let server: Awaited<ReturnType<typeof startTestServer>>;
let publisher: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  server = await startTestServer();
  publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
});
afterAll(async () => {
  await server?.stop();
});

/** A CSV line per row, in the template's columns. */
const csvOf = (rows: Record<string, string>[]) => toCsv([[...IMPORT_COLUMNS], ...rows.map((r) => IMPORT_COLUMNS.map((c) => r[c] ?? ''))]);

const goodRow = (i = 0): Record<string, string> => ({
  steel: i % 2 ? 'D2' : 'aisi-d2',
  hardness: String(60 + (i % 3)),
  abrasive: 'cbn-electroplated-wheel-250-b126',
  grit_standard: 'iso6106',
  grit: 'B126',
  angle_per_side_deg: String(12 + (i % 8)),
  sharpness_method: 'push-cut-test-v2',
  readings_g: `${150 + (i % 50)};${160 + (i % 40)};${155 + (i % 30)};170;165`,
  notes: `Invented test row ${i}: light passes & a <clean> burr-free edge.`,
});

const post = (body: string | Buffer, query = '', who = publisher) =>
  who.agent.post(`/api/import/results${query}`).set('X-CSRF-Token', who.csrf).attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'), { filename: 'results.csv', contentType: 'text/csv' });

describe('the import file format (shared/csv.ts)', () => {
  it('maps headers case- and punctuation-insensitively and names missing required columns', () => {
    const m = mapHeader(['Steel', 'Hardness (HRC)', 'ABRASIVE', 'method', 'Readings (g)', 'colour']);
    expect(m.index).toMatchObject({ steel: 0, abrasive: 2, sharpness_method: 3, readings_g: 4 });
    expect(m.index.hardness).toBeUndefined(); // "hardness_hrc" is not a known spelling
    expect(m.missing).toEqual(['hardness']);
    expect(m.unknown).toEqual(['Hardness (HRC)', 'colour']);
  });

  it('reads a hardness with its scale and a decimal comma, and names the column of a bad number', () => {
    const lookup = { steel: (t: string) => (t === 'D2' ? 'aisi-d2' : null), abrasive: () => 'x', method: () => 'm' };
    const ok = rowToResultInput({ steel: 'D2', hardness: '740 HV', abrasive: 'a', angle_per_side_deg: '15,5', sharpness_method: 'm', readings_g: '180; 175 190' }, lookup);
    expect(ok.issues).toEqual([]);
    expect(ok.input).toMatchObject({ steel: 'aisi-d2', hardness: { value: 740, scale: 'HV' }, edgeAngle: { perSideDeg: 15.5 }, sharpness: { readingsG: [180, 175, 190] } });
    const bad = rowToResultInput({ steel: 'Q9', hardness: 'hard', abrasive: 'a', angle_per_side_deg: '15', sharpness_method: 'm', readings_g: '180;x' }, lookup);
    expect(bad.issues.map((i) => i.column).sort()).toEqual(['hardness', 'readings_g', 'steel']);
  });

});

describe('notes of imported rows', () => {
  it('render exactly as the rich-text renderer renders them, however hostile the text (fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 80 }), fc.string({ maxLength: 20 }), (a, b) => {
        const doc = plainToRichText(`${a}\n\n${b}<&>"'`);
        expect(plainParagraphsHtml(doc)).toBe(renderWithTipTap(doc));
      }),
      { numRuns: 150 },
    );
  });
});

describe('GET /api/import/template.csv', () => {
  it('gives the header and two example lines that a dry run accepts', async () => {
    const res = await request(server.url).get('/api/import/template.csv').expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const rows = Papa.parse<string[]>(res.text.trim()).data;
    expect(rows[0]).toEqual([...IMPORT_COLUMNS]);
    expect(rows).toHaveLength(3);
    const dry = await post(res.text, '?dryRun=1').expect(200);
    expect(dry.body).toMatchObject({ rows: 2, valid: 2, errors: [] });
    // The second example gives HV and a wheel setup: converted like a single post.
    expect(dry.body.preview[1].hrc).toBeGreaterThan(60);
    expect(dry.body.preview[1].perSideDeg).toBeGreaterThan(5);
  });
});

describe('POST /api/import/results', () => {
  it('refuses a visitor with 401 and a member with 403', async () => {
    await request(server.url).post('/api/import/results?dryRun=1').attach('file', Buffer.from(csvOf([goodRow()])), 'r.csv').expect(401);
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    await post(csvOf([goodRow()]), '?dryRun=1', member).expect(403);
  });

  it('dry-runs a good file without storing anything, then imports it as pending in one go', async () => {
    const before = await Result.count();
    const file = csvOf([goodRow(0), goodRow(1), goodRow(2)]);
    const dry = await post(file, '?dryRun=1').expect(200);
    expect(dry.body).toMatchObject({ rows: 3, valid: 3, errors: [], publishesAtOnce: false });
    expect(await Result.count()).toBe(before);

    const res = await post(file).expect(201);
    expect(res.body).toMatchObject({ imported: 3, status: 'pending' });
    expect(await Result.count()).toBe(before + 3);
    const stored = await Result.findAll({ where: { authorId: (await Result.findOne({ order: [['id', 'DESC']] }))!.authorId }, order: [['id', 'DESC']], limit: 3 });
    expect(stored.every((r) => r.status === 'pending')).toBe(true);
    // "D2" was matched by designation to the steel page aisi-d2.
    expect(stored.map((r) => r.input.steel)).toEqual(['aisi-d2', 'aisi-d2', 'aisi-d2']);
    const events = await ResultEvent.count({ where: { resultId: stored.map((r) => r.id) } });
    expect(events).toBe(3);
    expect(await ImportBatch.findByPk(res.body.importId)).not.toBeNull();
  });

  it('lists every error of a mixed file by row and column, and stores nothing', async () => {
    const before = await Result.count();
    const rows = [
      goodRow(0),
      { ...goodRow(1), steel: 'no-such-steel' }, // row 3
      { ...goodRow(2), hardness: '95' }, // row 4: outside ASTM E140 Table 1
      { ...goodRow(3), angle_per_side_deg: '-3', readings_g: '' }, // row 5: two problems
      { ...goodRow(4), grit: 'Z999' }, // row 6
      goodRow(5),
    ];
    const dry = await post(csvOf(rows), '?dryRun=1').expect(200);
    expect(dry.body.rows).toBe(6);
    expect(dry.body.valid).toBe(2);
    const found = (dry.body.errors as { row: number; column: string }[]).map((e) => `${e.row}:${e.column}`);
    expect(found).toEqual(expect.arrayContaining(['3:steel', '4:hardness', '5:angle_per_side_deg', '5:readings_g', '6:grit']));
    const res = await post(csvOf(rows)).expect(400);
    expect(res.body.error).toMatch(/Nothing was imported/);
    expect(res.body.errors).toEqual(dry.body.errors);
    expect(await Result.count()).toBe(before);
  });

  it('reports a missing required column on the header row', async () => {
    const file = 'steel,hardness,abrasive,angle_per_side_deg,readings_g\r\naisi-d2,61,cbn-electroplated-wheel-250-b126,15,180\r\n';
    const dry = await post(file, '?dryRun=1').expect(200);
    expect(dry.body.errors).toEqual([{ row: 1, column: 'sharpness_method', message: expect.stringMatching(/missing/) }]);
  });

  it('refuses UTF-16 and Latin-1 files with a clear message naming the file', async () => {
    const text = csvOf([{ ...goodRow(), heat_treatment: 'trempé à l’huile' }]);
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
    const r16 = await post(utf16, '?dryRun=1').expect(400);
    expect(r16.body.error).toMatch(/UTF-16/);
    expect(r16.body.issues[0].path).toBe('file');
    const latin1 = Buffer.from(text.replace('’', "'"), 'latin1');
    const rl = await post(latin1, '?dryRun=1').expect(400);
    expect(rl.body.error).toMatch(/not valid UTF-8.*line 2.*Latin-1/);
    // The same text in UTF-8 (with a byte-order mark, as spreadsheets write it) is fine.
    const utf8 = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text, 'utf8')]);
    expect((await post(utf8, '?dryRun=1').expect(200)).body.valid).toBe(1);
  });

  it('keeps hostile cells as text and neutralises them in the CSV export', async () => {
    const hostile = { ...goodRow(), heat_treatment: '=HYPERLINK("http://evil.test","x")', notes: '@SUM(1+1)*cmd|\' /C calc\'!A0' };
    const res = await post(csvOf([hostile, { ...goodRow(1), heat_treatment: '+1-1' }, { ...goodRow(2), heat_treatment: '-2+3' }, { ...goodRow(3), heat_treatment: '\uFF1D1+1' }])).expect(201);
    expect(res.body.imported).toBe(4);
    const exported = await publisher.agent.get('/api/me/results.csv').expect(200);
    const rows = Papa.parse<string[]>(exported.text.trim()).data;
    const header = rows[0];
    const ht = header.indexOf('heat_treatment');
    const notes = header.indexOf('notes');
    const cells = rows.slice(1).flatMap((r) => [r[ht], r[notes]]).filter(Boolean);
    expect(cells).toEqual(expect.arrayContaining([`'=HYPERLINK("http://evil.test","x")`, `'+1-1`, `'-2+3`, `'@SUM(1+1)*cmd|' /C calc'!A0`, `'\uFF1D1+1`]));
    // No text cell of the export starts with a formula character.
    for (const row of rows.slice(1)) for (const cell of row) if (Number.isNaN(Number(cell))) expect(cell).not.toMatch(/^[=+\-@\uFF1D\uFF0B\uFF0D\uFF20\t\r]/);
  });

  it('imports 10 000 rows in one transaction', async () => {
    const before = await Result.count();
    const file = csvOf(Array.from({ length: 10_000 }, (_, i) => goodRow(i)));
    const started = performance.now();
    const dry = await post(file, '?dryRun=1').expect(200);
    const dryMs = performance.now() - started;
    expect(dry.body).toMatchObject({ rows: 10_000, valid: 10_000, errors: [] });
    const t1 = performance.now();
    const res = await post(file).expect(201);
    const importMs = performance.now() - t1;
    expect(res.body.imported).toBe(10_000);
    expect(await Result.count()).toBe(before + 10_000);
    // A figure for the report, not an assertion (bars are measured by benchmarks).
    console.info(`10 000-row import: dry run ${Math.round(dryMs)} ms, import ${Math.round(importMs)} ms (${(file.length / 1e6).toFixed(1)} MB)`);
  }, 120_000);

  it('publishes at once, cells and search included, when the site trusts publishers', async () => {
    const admin = await signIn(server.url, await demoHandle(server.url, 'admin'));
    const cellN = async () => {
      const res = await request(server.url).get('/api/compare?method=push-cut-test-v2&steel=aisi-52100&material=diamond').expect(200);
      return (res.body.rows as { n: number }[]).reduce((sum, r) => sum + r.n, 0);
    };
    await admin.agent.put('/api/publishers/settings').set('X-CSRF-Token', admin.csrf).send({ trustPublisherImports: true }).expect(200);
    const before = await cellN();
    const row = { ...goodRow(), steel: 'aisi-52100', abrasive: 'diamond-electroplated-wheel-250-d46', grit_standard: 'iso6106', grit: 'D46' };
    const res = await post(csvOf([row, row])).expect(201);
    expect(res.body.status).toBe('approved');
    expect(await cellN()).toBe(before + 2);
    const search = await request(server.url).get('/api/search?q=52100&type=result').expect(200);
    expect(search.body.hits.map((h: { id: number }) => h.id)).toEqual(expect.arrayContaining([expect.any(Number)]));
    const audit = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const log = await audit.agent.get('/api/audit?action=site-settings').expect(200);
    expect(log.body.items[0]).toMatchObject({ action: 'site-settings.update', outcome: 'done', details: { key: 'trustPublisherImports', from: false, to: true } });
    await admin.agent.put('/api/publishers/settings').set('X-CSRF-Token', admin.csrf).send({ trustPublisherImports: false }).expect(200);
  });
});

describe('an import report that says everything (issue 17)', () => {
  it('serves the template with LF line ends only', async () => {
    const res = await request(server.url).get('/api/import/template.csv').expect(200);
    expect(res.text).not.toContain('\r');
    expect(res.text.endsWith('\n')).toBe(true);
  });

  it('reads LF, CRLF, CR, a mix of them and a byte-order mark alike', async () => {
    const lines = csvOf([goodRow(0), goodRow(1), goodRow(2)]).trimEnd().split('\r\n');
    const files = {
      lf: lines.join('\n') + '\n',
      crlf: lines.join('\r\n') + '\r\n',
      mixed: `${lines[0]}\r\n${lines[1]}\n${lines[2]}\r\n${lines[3]}\n`,
      bomMixed: `\uFEFF${lines[0]}\r\n${lines[1]}\r\n${lines[2]}\n${lines[3]}`,
    };
    for (const [name, text] of Object.entries(files)) {
      const dry = await post(text, '?dryRun=1').expect(200);
      expect({ name, rows: dry.body.rows, valid: dry.body.valid, errors: dry.body.errors }).toEqual({ name, rows: 3, valid: 3, errors: [] });
    }
  });

  it('reports every bad field of a row, with the nearest slug for a steel, abrasive or method one typo away', async () => {
    const bad = { ...goodRow(0), steel: 'aisi-d3x', hardness: 'sixty', abrasive: 'cbn-electroplated-wheel-250-b12', sharpness_method: 'push-cut-tset-v2', angle_per_side_deg: '75' };
    const dry = await post(csvOf([bad]), '?dryRun=1').expect(200);
    const byColumn = Object.fromEntries((dry.body.errors as { column: string; message: string }[]).map((e) => [e.column, e.message]));
    expect(Object.keys(byColumn).sort()).toEqual(['abrasive', 'angle_per_side_deg', 'hardness', 'sharpness_method', 'steel']);
    expect(byColumn.steel).toMatch(/did you mean "aisi-d2"/);
    expect(byColumn.abrasive).toMatch(/did you mean "cbn-electroplated-wheel-250-b126"/);
    // A swap of two neighbouring letters counts as one edit (Damerau–Levenshtein).
    expect(byColumn.sharpness_method).toMatch(/did you mean "push-cut-test-v2"/);
    // A method of the wrong kind: the same rule as a single submission.
    const kinds = await post(csvOf([{ ...goodRow(0), sharpness_method: 'card-cut-retention-v1' }]), '?dryRun=1').expect(200);
    expect(kinds.body.errors).toEqual([expect.objectContaining({ column: 'sharpness_method', message: expect.stringMatching(/retention method/) })]);
    // Nothing near: no suggestion.
    const far = await post(csvOf([{ ...goodRow(0), steel: 'quite-unknown-steel' }]), '?dryRun=1').expect(200);
    expect(far.body.errors[0].message).not.toMatch(/did you mean/);
  });
});
