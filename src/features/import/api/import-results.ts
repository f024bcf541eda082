import type { ImportReport } from '@shared/schemas/import';
import { uploadWithProgress, UploadError } from '@/lib/upload-with-progress';

export type { ImportReport };

/** What an accepted import answers. */
export interface ImportDone {
  imported: number;
  importId: number;
  status: 'pending' | 'approved';
}

const formOf = (file: File) => {
  const form = new FormData();
  form.append('file', file);
  return form;
};

/** POST /api/import/results?dryRun=1: every row parsed, matched and validated; nothing stored. */
export function checkImport(file: File, onProgress?: (sent: number) => void): Promise<ImportReport> {
  return uploadWithProgress<ImportReport>('/api/import/results?dryRun=1', formOf(file), onProgress);
}

/** POST /api/import/results: all rows in one go, or none (then the error carries the same report). */
export function importResults(file: File, onProgress?: (sent: number) => void): Promise<ImportDone> {
  return uploadWithProgress<ImportDone>('/api/import/results', formOf(file), onProgress);
}

/** The report inside a refused import, when the server sent one. */
export function reportOf(error: unknown): ImportReport | null {
  if (!(error instanceof UploadError)) return null;
  const body = error.body as Partial<ImportReport> | null;
  return body && Array.isArray(body.errors) && typeof body.rows === 'number' ? (body as ImportReport) : null;
}

/** Where the template file is served. */
export const IMPORT_TEMPLATE_URL = '/api/v1/import/template.csv';
