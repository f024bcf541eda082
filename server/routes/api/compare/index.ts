import { Router } from 'express';
import {
  compareCellQuerySchema,
  compareExportQuerySchema,
  comparePairedQuerySchema,
  comparePointsQuerySchema,
  compareQuerySchema,
} from '@shared/schemas/compare';
import type { AppContext } from '../../../context';
import { route } from '../../../middleware/validate';
import { actorOf } from '../../../middleware/auth';
import type { AnswerCache } from '../../../middleware/answer-cache';
import { compareBody, compareExport } from '../../../queries/compare';
import { abrasiveNames } from '../../../queries/compare-lookups';
import { compareCell } from '../../../queries/compare-cell';
import { comparePaired } from '../../../queries/compare-paired';
import { compareDifference } from '../../../queries/compare-difference';
import { comparePoints } from '../../../queries/compare-points';
import { setPageLinks } from '../../../presenters/page-links';
import { presentResult } from '../../../presenters/result';
import type { compareCellSchema, compareDifferenceSchema, comparePairedSchema, comparePointsSchema, Presented } from '@shared/schemas/responses';

/**
 * The comparison under /api/compare: the table (and pivot), its export, a cell's results, the
 * tester-paired comparison of two cells, their difference as independent samples, and the chart
 * points. All read approved results only.
 */
export function compareRouter(ctx: AppContext, answers: AnswerCache): Router {
  const router = Router();
  // The same for whoever asks (what it follows: KEPT.compare in server/changes/kept.ts).
  const kept = answers.keep('compare', { forEveryone: true });

  router.get('/compare', kept, route({ query: compareQuerySchema }, async (req, res) => {
    const { body, etag, page } = await compareBody(req.valid.query);
    // Express would hash the body again for its ETag; this one was made once, with the body.
    setPageLinks(req, res, page).set('ETag', etag);
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(body);
  }));

  router.get('/compare/export', route({ query: compareExportQuerySchema }, async (req, res) => {
    const { format, ...filters } = req.valid.query;
    const file = await compareExport(filters, format, ctx.baseUrl);
    res
      .set('Content-Type', file.contentType)
      .set('Content-Disposition', `attachment; filename="${file.filename}"`)
      .set('Cache-Control', 'no-store')
      .send(file.body);
  }));

  router.get('/compare/cell', route({ query: compareCellQuerySchema }, async (req, res) => {
    const { results, ...cell } = await compareCell(req.valid.query);
    const viewer = actorOf(req);
    const names = await abrasiveNames();
    setPageLinks(req, res, cell).json({ ...cell, items: results.map((r) => presentResult(r, viewer, names)) } satisfies Presented<typeof compareCellSchema>);
  }));

  router.get('/compare/paired', route({ query: comparePairedQuerySchema }, async (req, res) => {
    res.json((await comparePaired(req.valid.query)) satisfies Presented<typeof comparePairedSchema>);
  }));

  // Two cells as independent samples; the same query as the paired comparison.
  router.get('/compare/difference', kept, route({ query: comparePairedQuerySchema }, async (req, res) => {
    res.json((await compareDifference(req.valid.query)) satisfies Presented<typeof compareDifferenceSchema>);
  }));

  router.get('/compare/points', route({ query: comparePointsQuerySchema }, async (req, res) => {
    res.json((await comparePoints(req.valid.query)) satisfies Presented<typeof comparePointsSchema>);
  }));

  return router;
}
