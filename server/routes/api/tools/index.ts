import { Router } from 'express';
import type { z } from 'zod';
import { gritBand, nearestGrades, parseGrit } from '@shared/grit';
import { convertHardness } from '@shared/hardness';
import { angleFromSetup, gapForAngle, sideAngleFromSetup, sideGapForAngle, wearDrift } from '@shared/geometry';
import { cardCutRetention } from '@shared/retention';
import {
  angleToolQuerySchema,
  gritToolQuerySchema,
  hardnessToolQuerySchema,
  retentionToolBodySchema,
  sideAngleToolQuerySchema,
  wearDriftQuerySchema,
} from '@shared/schemas/tools';
import { validate } from '../../../middleware/validate';

/**
 * The calculators as an API: the shared computations, unchanged. Their ComputationErrors become
 * 400 with the field named (by the error handler).
 */
export function toolsRouter(): Router {
  const router = Router();

  router.get('/tools/grit', validate({ query: gritToolQuerySchema }), (req, res) => {
    const q = req.valid.query as z.infer<typeof gritToolQuerySchema>;
    const parsed = parseGrit(q.grade, q.standard);
    res.json({
      standard: parsed.standard,
      grade: parsed.grade,
      inferred: parsed.inferred,
      micrometres: parsed.micrometres,
      band: gritBand(parsed.micrometres, q.step === '0.5' ? 0.5 : 1),
      nearest: nearestGrades(parsed.micrometres),
    });
  });

  router.get('/tools/hardness', validate({ query: hardnessToolQuerySchema }), (req, res) => {
    const q = req.valid.query as z.infer<typeof hardnessToolQuerySchema>;
    res.json(convertHardness(q.value, q.scale));
  });

  router.get('/tools/angle', validate({ query: angleToolQuerySchema }), (req, res) => {
    const q = req.valid.query as z.infer<typeof angleToolQuerySchema>;
    const { gapMm, perSideDeg, ...setup } = q;
    res.json(gapMm !== undefined ? angleFromSetup({ ...setup, gapMm }) : gapForAngle({ ...setup, perSideDeg: perSideDeg! }));
  });

  router.get('/tools/side-angle', validate({ query: sideAngleToolQuerySchema }), (req, res) => {
    const { gapMm, perSideDeg, ...setup } = req.valid.query as z.infer<typeof sideAngleToolQuerySchema>;
    res.json(gapMm !== undefined ? sideAngleFromSetup({ ...setup, gapMm }) : sideGapForAngle({ ...setup, perSideDeg: perSideDeg! }));
  });

  router.get('/tools/wear-drift', validate({ query: wearDriftQuerySchema }), (req, res) => {
    res.json(wearDrift(req.valid.query as z.infer<typeof wearDriftQuerySchema>));
  });

  router.post('/tools/retention', validate({ body: retentionToolBodySchema }), (req, res) => {
    const r = cardCutRetention((req.valid.body as z.infer<typeof retentionToolBodySchema>).cutsMm);
    res.json({ icpMm: r.icpMm, tccMm: r.tccMm, cycles: r.cycles, limits: r.limits, icpPass: r.icpPass, tccPass: r.tccPass });
  });

  return router;
}
