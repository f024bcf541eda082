import { z } from 'zod';

/** Limits of one import file, used by the server's upload and the client's check before sending. */
export const importLimits = {
  /** Largest file accepted, bytes (10 000 full rows take about 2.5 MB). */
  fileBytesMax: 16 * 1024 * 1024,
  /** Most data rows in one file. */
  rowsMax: 20_000,
  /** Normalised rows returned with a dry run, for the preview table. */
  previewRows: 50,
} as const;

/** Query of POST /api/import/results: `dryRun=1` validates and reports without storing. */
export const importQuerySchema = z
  .object({
    dryRun: z
      .enum(['1', '0', 'true', 'false'], { message: 'must be 1 or 0' })
      .optional()
      .transform((v) => v === '1' || v === 'true'),
  })
  .strict();

/** One problem with the file: the spreadsheet row (the header is row 1), the column and what is wrong. */
export interface ImportError {
  row: number;
  column: string;
  message: string;
}

/** One row as it would be stored: the page it matched and the values derived from it. */
export interface ImportPreviewRow {
  row: number;
  steel: string;
  abrasive: string;
  hrc: number;
  gritGrade: string;
  gritUm: number;
  perSideDeg: number;
  sharpnessMedianG: number;
}

/** What a dry run (or a refused import) reports. */
export interface ImportReport {
  rows: number;
  valid: number;
  errors: ImportError[];
  /** Columns of the header that match nothing and were ignored. */
  ignoredColumns: string[];
  /** The first rows, normalised. */
  preview: ImportPreviewRow[];
  /** Whether the rows would be published at once (the site trusts publishers' imports). */
  publishesAtOnce: boolean;
}
