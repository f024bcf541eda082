import { IMPORT_COLUMNS } from '@shared/csv';
import { toCsv, type CsvValue } from '@shared/csv-writer';
import { richTextToPlain } from '@shared/rich-text';
import { progressionCell } from '@shared/progression';
import type { Result } from '../models';

/** Extra columns of an export after the import columns: what the server derived and the state. */
const EXTRA = ['id', 'status', 'created_at', 'hrc', 'grit_um', 'inclusive_deg', 'median_g'] as const;

/**
 * Results as a CSV file in the import's own columns (so an export can be edited and imported
 * again), followed by the derived values. Every text cell goes through the formula
 * neutralisation of shared/csv-writer.ts, so a hostile cell cannot run as a spreadsheet formula.
 */
export function resultsCsv(results: Result[]): string {
  const rows: CsvValue[][] = [[...IMPORT_COLUMNS, ...EXTRA]];
  for (const r of results) {
    const i = r.input;
    const setup = 'setup' in i.edgeAngle ? i.edgeAngle.setup : null;
    const byColumn: Record<(typeof IMPORT_COLUMNS)[number], CsvValue> = {
      steel: i.steel,
      hardness: i.hardness.value,
      hardness_scale: i.hardness.scale,
      hardness_measured: i.hardness.measured,
      heat_treatment: i.heatTreatment,
      progression: progressionCell(i.progression),
      abrasive: i.abrasive,
      grit_standard: i.grit?.standard,
      grit: i.grit?.grade,
      angle_per_side_deg: 'perSideDeg' in i.edgeAngle ? i.edgeAngle.perSideDeg : null,
      wheel_diameter_mm: setup?.wheelDiameterMm,
      bar_diameter_mm: setup?.barDiameterMm,
      gap_mm: setup?.gapMm,
      projection_mm: setup?.projectionMm,
      sharpness_method: i.sharpness.method,
      readings_g: i.sharpness.readingsG.join(';'),
      retention_method: i.retention?.method,
      retention_cuts: i.retention?.cuts,
      notes: i.notes ? richTextToPlain(i.notes) : null,
    };
    rows.push([
      ...IMPORT_COLUMNS.map((c) => byColumn[c]),
      r.id,
      r.status,
      r.createdAt.toISOString(),
      Math.round(r.hrc * 10) / 10,
      Math.round(r.gritUm * 100) / 100,
      Math.round(r.inclusiveDeg * 100) / 100,
      r.sharpnessMedianG,
    ]);
  }
  return toCsv(rows);
}
