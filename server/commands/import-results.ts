import { isRetentionMethod } from '@shared/vocabulary';
import Papa from 'papaparse';
import { can, type Actor } from '@shared/permissions';
import { columnOfPath, IMPORT_COLUMNS, mapHeader, rowToResultInput, type ImportColumn } from '@shared/csv';
import { resultInputSchema, type ResultInput } from '@shared/schemas/result';
import { importLimits, type ImportError, type ImportPreviewRow, type ImportReport } from '@shared/schemas/import';
import { ComputationError } from '@shared/computation-error';
import { deriveResult } from '@shared/derive-result';
import { deriveProgression } from '@shared/progression';
import type { GritStandard } from '@shared/grit';
import type { AppContext } from '../context';
import { badRequest, forbidden, HttpError } from '../errors';
import { Abrasive, ImportBatch, ImportBatchResult, Method, Result, ResultEvent, Steel } from '../models';
import { loadPageLookup } from '../queries/page-lookup';
import { nearestName } from '@shared/nearest';
import { siteSettings } from '../queries/site-settings';
import { resultRow, type ResultReferences } from './submit-result';
import { insertRows } from '../db/insert-rows';

const fileError = (message: string) => badRequest(message, [{ path: 'file', message }]);

/** Line number (1-based) of character offset `at` in `text`. */
const lineAt = (text: string, at: number) => text.slice(0, at).split('\n').length;

/**
 * The file's bytes → its text. Only UTF-8 is accepted (with or without a byte-order mark):
 * UTF-16, Latin-1/Windows-1252 bytes and spreadsheet workbooks are refused with an error that
 * says what was found and how to save the file instead.
 */
export function decodeCsv(bytes: Buffer): string {
  if (bytes.length === 0) throw fileError('The file is empty.');
  const howTo = 'Save it from your spreadsheet as "CSV UTF-8 (comma delimited)" and upload it again.';
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) throw fileError(`The file is encoded as UTF-16, not UTF-8. ${howTo}`);
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) throw fileError(`This is a spreadsheet workbook (.xlsx or .ods), not a CSV file. ${howTo}`);
  if (bytes.subarray(0, 4096).includes(0)) throw fileError(`The file contains NUL bytes, so it is not UTF-8 text (UTF-16 without a byte-order mark, or not a text file). ${howTo}`);
  const text = new TextDecoder('utf-8').decode(bytes);
  const bad = text.indexOf('\uFFFD');
  if (bad >= 0) {
    throw fileError(`The file is not valid UTF-8: line ${lineAt(text, bad)} has bytes that are not UTF-8 (the file looks like Latin-1 or Windows-1252). ${howTo}`);
  }
  return text.replace(/^\uFEFF/, '');
}

/** The delimiter the header line uses: comma, semicolon or tab (readings inside cells may use ";"). */
function delimiterOf(text: string): string {
  const header = text.slice(0, Math.max(0, text.search(/\r?\n/)) || text.length);
  const counts = [',', ';', '\t'].map((d) => ({ d, n: header.split(d).length - 1 }));
  return counts.sort((a, b) => b.n - a.n)[0].n > 0 ? counts[0].d : ',';
}

/** One valid row, ready to store. */
interface ValidRow {
  row: number;
  input: ResultInput;
  refs: ResultReferences;
}

/** The parsed and checked file: the report, and the rows that passed. */
export interface CheckedImport {
  report: ImportReport;
  valid: ValidRow[];
}

/**
 * Parses a CSV of results (papaparse), maps each row onto the new-result form's input, and
 * validates it with the same zod schema (resultInputSchema) and the same derivations as a
 * single post, collecting every problem by spreadsheet row (header = row 1) and column.
 */
export async function checkImport(bytes: Buffer): Promise<CheckedImport> {
  // Any line ending (LF, CRLF, CR, or a mix of them, as editors leave when rows are added): one kind for the parser.
  const text = decodeCsv(bytes).replace(/\r\n?/g, '\n');
  const parsed = Papa.parse<string[]>(text, { delimiter: delimiterOf(text), skipEmptyLines: false });
  const records = parsed.data;
  if (!records.length || records[0].every((c) => !c.trim())) throw fileError('The file has no header row.');
  const errors: ImportError[] = [];
  for (const e of parsed.errors) {
    // Papaparse counts records from 0 with the header as record 0.
    if (e.code === 'UndetectableDelimiter') continue;
    errors.push({ row: (e.row ?? 0) + 1, column: '(row)', message: e.code === 'MissingQuotes' ? 'a quoted cell is not closed' : e.message });
  }
  const mapping = mapHeader(records[0]);
  for (const c of mapping.missing) errors.push({ row: 1, column: c, message: 'required column is missing from the header' });
  for (const c of mapping.duplicate) errors.push({ row: 1, column: c, message: 'column appears twice in the header' });
  const dataRows = records.slice(1).map((cells, i) => ({ row: i + 2, cells })).filter((r) => r.cells.some((c) => c.trim()));
  if (dataRows.length > importLimits.rowsMax) throw fileError(`The file has ${dataRows.length} rows; one import takes at most ${importLimits.rowsMax}. Split it into smaller files.`);
  const settings = await siteSettings();
  const report: ImportReport = { rows: dataRows.length, valid: 0, errors, ignoredColumns: mapping.unknown, preview: [], publishesAtOnce: settings.trustPublisherImports };
  if (mapping.missing.length || mapping.duplicate.length) return { report, valid: [] };
  if (!dataRows.length) {
    errors.push({ row: 2, column: '(row)', message: 'the file has a header but no rows of results' });
    return { report, valid: [] };
  }

  const lookup = await loadPageLookup();
  const [steels, abrasives, methods] = await Promise.all([Steel.findAll(), Abrasive.findAll(), Method.findAll()]);
  const steelBySlug = new Map(steels.map((s) => [s.slug, s]));
  const abrasiveBySlug = new Map(abrasives.map((a) => [a.slug, a]));
  const methodBySlug = new Map(methods.map((m) => [m.slug, m]));
  const known = { steel: [...steelBySlug.keys()], abrasive: [...abrasiveBySlug.keys()], method: [...methodBySlug.keys()] };
  const headerWidth = records[0].length;
  const valid: ValidRow[] = [];

  for (const { row, cells } of dataRows) {
    const rowErrors: ImportError[] = [];
    if (cells.length > headerWidth && cells.slice(headerWidth).some((c) => c.trim())) {
      rowErrors.push({ row, column: '(row)', message: `has ${cells.length} cells but the header has ${headerWidth}; quote cells that contain the delimiter` });
    }
    const byColumn: Partial<Record<ImportColumn, string>> = {};
    for (const column of IMPORT_COLUMNS) {
      const i = mapping.index[column];
      if (i !== undefined) byColumn[column] = cells[i] ?? '';
    }
    const mapped = rowToResultInput(byColumn, lookup);
    for (const issue of mapped.issues) rowErrors.push({ row, column: issue.column, message: withSuggestion(issue, byColumn, known) });
    // The same rule as a single submission: a sharpness method measures sharpness, a retention method counts cuts.
    const sharpnessMethod = methodBySlug.get(byColumn.sharpness_method?.trim() ?? '');
    if (sharpnessMethod && isRetentionMethod(sharpnessMethod)) rowErrors.push({ row, column: 'sharpness_method', message: `"${sharpnessMethod.slug}" is a retention method; choose a sharpness method` });
    const retentionMethod = methodBySlug.get(byColumn.retention_method?.trim() ?? '');
    if (retentionMethod && !isRetentionMethod(retentionMethod)) rowErrors.push({ row, column: 'retention_method', message: `"${retentionMethod.slug}" defines no retention medium; choose a retention method` });
    // Every problem of the row at once: the schema's too, except on columns already reported.
    const checked = resultInputSchema.safeParse(mapped.input);
    if (!checked.success) {
      const reported = new Set(rowErrors.map((e) => e.column));
      for (const issue of checked.error.issues) {
        const column = columnOfPath(issue.path);
        if (!reported.has(column) && !(mapped.issues.length && issue.code === 'invalid_type' && issue.input === undefined)) rowErrors.push({ row, column, message: issue.message });
      }
    }
    if (!rowErrors.length && checked.success) {
        const input = checked.data;
        const refs: ResultReferences = {
          steel: steelBySlug.get(input.steel)!,
          abrasive: abrasiveBySlug.get(input.abrasive)!,
          sharpnessMethod: methodBySlug.get(input.sharpness.method)!,
          retentionMethod: input.retention ? methodBySlug.get(input.retention.method)! : null,
          stepAbrasives: new Map((input.progression ?? []).map((s) => [s.abrasive, abrasiveBySlug.get(s.abrasive)!])),
        };
        try {
          // Derive now, as storing would, so grit and setup problems are reported in the dry run.
          const derived = deriveResult(input, { standard: refs.abrasive.gritStandard as GritStandard, grade: refs.abrasive.gritGrade });
          deriveProgression(input.progression, (slug) => refs.stepAbrasives.get(slug)!);
          valid.push({ row, input, refs });
          if (report.preview.length < importLimits.previewRows) {
            const preview: ImportPreviewRow = {
              row,
              steel: refs.steel.name,
              abrasive: refs.abrasive.name,
              hrc: Math.round(derived.hrc * 10) / 10,
              gritGrade: derived.gritGrade,
              gritUm: Math.round(derived.gritUm * 100) / 100,
              perSideDeg: Math.round(derived.perSideDeg * 100) / 100,
              sharpnessMedianG: derived.sharpnessMedianG,
            };
            report.preview.push(preview);
          }
        } catch (err) {
          if (!(err instanceof ComputationError)) throw err;
          const column = err.field ? columnOfPath(err.field.split('.')) : input.grit ? 'grit' : 'abrasive';
          rowErrors.push({ row, column, message: err.message });
        }
    }
    errors.push(...rowErrors);
  }
  report.valid = valid.length;
  errors.sort((a, b) => a.row - b.row);
  return { report, valid };
}

const SUGGESTED: Partial<Record<string, 'steel' | 'abrasive' | 'method'>> = { steel: 'steel', abrasive: 'abrasive', sharpness_method: 'method', retention_method: 'method' };

/** An unknown page's message, with the nearest slug when one is a typo away ("did you mean"). */
function withSuggestion(issue: { column: string; message: string }, cells: Partial<Record<ImportColumn, string>>, known: Record<'steel' | 'abrasive' | 'method', string[]>): string {
  const kind = SUGGESTED[issue.column];
  const typed = (cells[issue.column as ImportColumn] ?? '').trim();
  if (!kind || !typed || !/^no .* page/.test(issue.message)) return issue.message;
  const nearest = nearestName(typed, known[kind]);
  return nearest ? `${issue.message}; did you mean "${nearest}"?` : issue.message;
}

/** A refused import: 400 with the dry run's report, so the client shows the same list. */
export class ImportRefused extends HttpError {
  constructor(readonly report: ImportReport) {
    super(400, 'bad_request', `Nothing was imported: ${report.errors.length} problem${report.errors.length === 1 ? '' : 's'} in the file.`);
  }
}

const CHUNK = 500;

/**
 * Imports a publisher's CSV: every row checked first; if any row has a problem, nothing is
 * stored (ImportRefused with the report). Otherwise all rows go in ONE write transaction, as
 * `pending` (or `approved` when the site trusts publishers' imports, with their comparison
 * cells refreshed in that transaction and the search index following the change feed).
 */
export async function importResults(ctx: AppContext, actor: Actor, bytes: Buffer): Promise<{ imported: number; importId: number; status: 'pending' | 'approved' }> {
  if (!can(actor, 'import:results')) throw forbidden('Bulk import is for publishers.');
  const { report, valid } = await checkImport(bytes);
  if (report.errors.length || !valid.length) throw new ImportRefused(report);
  const status = report.publishesAtOnce ? 'approved' : 'pending';
  const now = new Date();
  const rows = valid.map((v) => ({ ...resultRow(actor.id, status, v.input, v.refs), approvedAt: status === 'approved' ? now : null }));

  const { importId, ids } = await ctx.db.write(async (transaction) => {
    const batch = await ImportBatch.create({ publisherId: actor.id, rows: rows.length, status }, { transaction });
    const ids: number[] = [];
    for (let i = 0; i < rows.length; i += CHUNK) {
      const inserted = await insertRows(Result, rows.slice(i, i + CHUNK), transaction);
      const events = inserted.flatMap((r) => {
        const first = { resultId: r.id, actorId: actor.id, fromStatus: null, toStatus: 'pending' as const, note: `Imported (import #${batch.id}).` };
        return status === 'approved'
          ? [first, { resultId: r.id, actorId: actor.id, fromStatus: 'pending' as const, toStatus: 'approved' as const, note: 'Published on import: the site trusts publishers’ imports.' }]
          : [first];
      });
      await insertRows(ResultEvent, events, transaction);
      await ImportBatchResult.bulkCreate(inserted.map((r) => ({ batchId: batch.id, resultId: r.id })), { transaction });
      for (const r of inserted) ids.push(r.id);
    }
    return { importId: batch.id, ids };
  });
  return { imported: ids.length, importId, status };
}

/** The GET /api/import/template.csv rows: the header and two valid example lines for the demo data. */
export function templateRows(): string[][] {
  return [
    [...IMPORT_COLUMNS],
    ['aisi-d2', '61', 'HRC', 'yes', 'Hardened and tempered twice', 'alox-vitrified-wheel-250-coarse > cbn-resin-wheel-250-b46 (iso6106 B64, 15°)', 'cbn-electroplated-wheel-250-b126', 'iso6106', 'B126', '15', '', '', '', '', 'push-cut-test-v2', '180;175;190;170;185', 'card-cut-retention-v1', '240', 'Invented example row. Light passes, burr removed on a strop.'],
    ['1.2379', '740 HV', '', 'no', '', '', 'alox-vitrified-wheel-250-coarse', '', '', '', '250', '12', '95', '160', 'push-cut-test-v2', '210;205;220;198;215', '', '', 'Invented example row: the angle comes from the wheel setup.'],
  ];
}
