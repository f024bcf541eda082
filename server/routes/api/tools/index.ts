import { Router } from 'express';
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
import {
  edgeAngleAnswerSchema,
  gritToolAnswerSchema,
  hardnessToolAnswerSchema,
  retentionToolAnswerSchema,
  wearDriftAnswerSchema,
  type Presented,
} from '@shared/schemas/responses';
import { route } from '../../../middleware/validate';

/**
 * The calculators as an API: the shared computations, unchanged. Their ComputationErrors become
 * 400 with the field named (by the error handler).
 */
export function toolsRouter(): Router {
  const router = Router();

  router.get('/tools/grit', route({ query: gritToolQuerySchema }, (req, res) => {
    const q = req.valid.query;
    const parsed = parseGrit(q.grade, q.standard);
    res.json({
      standard: parsed.standard,
      grade: parsed.grade,
      inferred: parsed.inferred,
      micrometres: parsed.micrometres,
      band: gritBand(parsed.micrometres, q.step === '0.5' ? 0.5 : 1),
      nearest: nearestGrades(parsed.micrometres),
    } satisfies Presented<typeof gritToolAnswerSchema>);
  }));

  router.get('/tools/hardness', route({ query: hardnessToolQuerySchema }, (req, res) => {
    const q = req.valid.query;
    res.json(convertHardness(q.value, q.scale) satisfies Presented<typeof hardnessToolAnswerSchema>);
  }));

  router.get('/tools/angle', route({ query: angleToolQuerySchema }, (req, res) => {
    const q = req.valid.query;
    const { gapMm, perSideDeg, ...setup } = q;
    res.json((gapMm !== undefined ? angleFromSetup({ ...setup, gapMm }) : gapForAngle({ ...setup, perSideDeg: perSideDeg! })) satisfies Presented<typeof edgeAngleAnswerSchema>);
  }));

  router.get('/tools/side-angle', route({ query: sideAngleToolQuerySchema }, (req, res) => {
    const { gapMm, perSideDeg, ...setup } = req.valid.query;
    res.json((gapMm !== undefined ? sideAngleFromSetup({ ...setup, gapMm }) : sideGapForAngle({ ...setup, perSideDeg: perSideDeg! })) satisfies Presented<typeof edgeAngleAnswerSchema>);
  }));

  router.get('/tools/wear-drift', route({ query: wearDriftQuerySchema }, (req, res) => {
    res.json(wearDrift(req.valid.query) satisfies Presented<typeof wearDriftAnswerSchema>);
  }));

  router.post('/tools/retention', route({ body: retentionToolBodySchema }, (req, res) => {
    const r = cardCutRetention(req.valid.body.cutsMm);
    res.json({ icpMm: r.icpMm, tccMm: r.tccMm, cycles: r.cycles, limits: r.limits, icpPass: r.icpPass, tccPass: r.tccPass } satisfies Presented<typeof retentionToolAnswerSchema>);
  }));

  return router;
}
