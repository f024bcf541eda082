import { Router } from 'express';
import { z } from 'zod';
import { slugSchema } from '@shared/schemas/result';
import { validate } from '../../../middleware/validate';
import { Abrasive, Method, Steel } from '../../../models';
import { approvedCounts, findPage, listAbrasives, listMethods, listSteels } from '../../../queries/pages';
import { presentAbrasive, presentAbrasiveSummary, presentMethod, presentMethodSummary, presentSteel, presentSteelSummary } from '../../../presenters/pages';

const slugParams = z.object({ slug: slugSchema }).strict();

/** The reference pages: steels, abrasives and methods, as lists and one by one. */
export function pagesRouter(): Router {
  const router = Router();

  router.get('/steels', async (_req, res) => {
    const [steels, counts] = await Promise.all([listSteels(), approvedCounts('steelId')]);
    res.json({ items: steels.map((s) => presentSteelSummary(s, counts.get(s.id) ?? 0)) });
  });
  router.get('/steels/:slug', validate({ params: slugParams }), async (req, res) => {
    const steel = await findPage(Steel, (req.valid.params as { slug: string }).slug, 'Steel page');
    const counts = await approvedCounts('steelId');
    res.json(presentSteel(steel, counts.get(steel.id) ?? 0));
  });

  router.get('/abrasives', async (_req, res) => {
    const [abrasives, counts] = await Promise.all([listAbrasives(), approvedCounts('abrasiveId')]);
    res.json({ items: abrasives.map((a) => presentAbrasiveSummary(a, counts.get(a.id) ?? 0)) });
  });
  router.get('/abrasives/:slug', validate({ params: slugParams }), async (req, res) => {
    const abrasive = await findPage(Abrasive, (req.valid.params as { slug: string }).slug, 'Abrasive page');
    const counts = await approvedCounts('abrasiveId');
    res.json(presentAbrasive(abrasive, counts.get(abrasive.id) ?? 0));
  });

  router.get('/methods', async (_req, res) => {
    const methods = await listMethods();
    const slugById = new Map(methods.map((m) => [m.id, m.slug]));
    res.json({ items: methods.map((m) => presentMethodSummary(m, slugById)) });
  });
  router.get('/methods/:slug', validate({ params: slugParams }), async (req, res) => {
    const method = await findPage(Method, (req.valid.params as { slug: string }).slug, 'Method page');
    const methods = await listMethods();
    res.json(presentMethod(method, new Map(methods.map((m) => [m.id, m.slug]))));
  });

  return router;
}
