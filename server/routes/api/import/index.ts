import { Router } from 'express';
import type { importedSchema, importRefusedSchema, importReportSchema, Presented } from '@shared/schemas/responses';
import { can } from '@shared/permissions';
import { toCsv } from '@shared/csv-writer';
import { importLimits, importQuerySchema } from '@shared/schemas/import';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route, validate } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { receiveFile } from '../../../storage/upload';
import { checkImport, ImportRefused, importResults, templateRows } from '../../../commands/import-results';
import { emptyQuerySchema } from '@shared/schemas/common';

/** Bulk import of results from CSV (publishers): the template, the dry run, the import. */
export function importRouter(ctx: AppContext): Router {
  const router = Router();

  // LF line ends: rows added in an editor that writes LF then match the rest of the file.
  router.get('/import/template.csv', route({ query: emptyQuerySchema }, (_req, res) => {
    res.type('text/csv; charset=utf-8').attachment('edgeledger-import-template.csv').send(toCsv(templateRows(), '\n'));
  }));

  router.post(
    '/import/results',
    requireUser,
    validate({ query: importQuerySchema }),
    (req, _res, next) => {
      // Refuse before reading the upload.
      if (!can(actorOf(req), 'import:results')) throw forbidden('Bulk import is for publishers; apply to become one from your page.');
      next();
    },
    receiveFile({ field: 'file', maxBytes: importLimits.fileBytesMax, fields: 2, fieldBytes: 200, what: 'CSV file' }),
    route({ query: importQuerySchema }, async (req, res) => {
      const { dryRun } = req.valid.query;
      const file = req.file!.buffer;
      if (dryRun) {
        res.json((await checkImport(file)).report satisfies Presented<typeof importReportSchema>);
        return;
      }
      try {
        res.status(201).json((await importResults(ctx, actorOf(req)!, file)) satisfies Presented<typeof importedSchema>);
      } catch (err) {
        // A refused import answers with the same report as the dry run.
        if (!(err instanceof ImportRefused)) throw err;
        res.status(400).json({ error: err.message, ...err.report } satisfies Presented<typeof importRefusedSchema>);
      }
    }),
  );

  return router;
}
