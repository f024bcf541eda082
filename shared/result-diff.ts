import type { ResultInput } from './schemas/result';
import { richTextToPlain, type RichTextNode } from './rich-text';
import { canonicalJson } from './page-diff';

/**
 * What a revision of a result changes: each entered field that differs between the version it
 * replaces and the proposed one, as words a reviewer reads (dotted path, label, both values).
 * Pure: plain data in, plain data out.
 */
export interface ResultFieldChange {
  path: string;
  label: string;
  before: string | null;
  after: string | null;
}

const LABELS: Record<string, string> = {
  steel: 'Steel',
  'hardness.value': 'Hardness',
  'hardness.scale': 'Hardness scale',
  'hardness.measured': 'Hardness measured',
  heatTreatment: 'Heat treatment',
  abrasive: 'Abrasive',
  'grit.standard': 'Grit standard',
  'grit.grade': 'Grit grade',
  'edgeAngle.perSideDeg': 'Angle per side (°)',
  'edgeAngle.setup.wheelDiameterMm': 'Wheel diameter (mm)',
  'edgeAngle.setup.barDiameterMm': 'Bar diameter (mm)',
  'edgeAngle.setup.gapMm': 'Gap (mm)',
  'edgeAngle.setup.projectionMm': 'Projection (mm)',
  'sharpness.method': 'Sharpness method',
  'sharpness.readingsG': 'Readings (g)',
  'retention.method': 'Retention method',
  'retention.cuts': 'Retention cuts',
  notes: 'Notes',
};

/** The entered values of a result as dotted paths and the words shown for each. */
function flatten(input: ResultInput): Map<string, string> {
  const out = new Map<string, string>();
  const walk = (value: unknown, path: string) => {
    if (value === undefined || value === null) return;
    if (path === 'notes') {
      out.set(path, richTextToPlain(value as RichTextNode));
    } else if (Array.isArray(value)) {
      out.set(path, value.join(', '));
    } else if (typeof value === 'object') {
      for (const [k, v] of Object.entries(value as Record<string, unknown>)) walk(v, path ? `${path}.${k}` : k);
    } else {
      out.set(path, typeof value === 'boolean' ? (value ? 'yes' : 'no') : String(value));
    }
  };
  walk(input, '');
  return out;
}

/** Every entered field that differs between `before` and `after`, in the form's order. */
export function resultChanges(before: ResultInput, after: ResultInput): ResultFieldChange[] {
  if (canonicalJson(before) === canonicalJson(after)) return [];
  const a = flatten(before);
  const b = flatten(after);
  const order = Object.keys(LABELS);
  const paths = [...new Set([...a.keys(), ...b.keys()])].sort((x, y) => rank(order, x) - rank(order, y));
  return paths
    .filter((p) => a.get(p) !== b.get(p))
    .map((p) => ({ path: p, label: LABELS[p] ?? p, before: a.get(p) ?? null, after: b.get(p) ?? null }));
}

function rank(order: string[], path: string): number {
  const i = order.indexOf(path);
  return i < 0 ? order.length : i;
}
