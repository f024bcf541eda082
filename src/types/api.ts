/**
 * Shapes of what the server sends back (API v1). Inputs are typed by the shared zod schemas;
 * these are the outputs, which the server's presenters build.
 */
import type { RichTextNode } from '@shared/rich-text';
import type { Role } from '@shared/permissions';
import type { ResultStatus } from '@shared/schemas/result';
import type { HardnessScale } from '@shared/hardness';
import type { GritStandard } from '@shared/grit';

export interface SessionUser {
  handle: string;
  displayName: string;
  role: Role;
}

export interface Session {
  user: SessionUser | null;
  csrfToken: string;
}

export interface DemoAccount {
  handle: string;
  displayName?: string;
  role: Role;
}

/** A particle-size class in micrometres, lower and upper bound. */
export interface GritBand {
  loUm: number;
  hiUm: number;
}

export interface WheelSetupValues {
  wheelDiameterMm: number;
  barDiameterMm: number;
  gapMm: number;
  projectionMm: number;
}

export interface TrailEntry {
  from: ResultStatus | null;
  to: ResultStatus;
  at: string;
  by: { handle: string } | null;
  note: string | null;
}

/** A result in a list (GET /api/results); GET /api/results/:id gives the whole Result. */
export interface ResultSummary {
  id: number;
  status: ResultStatus;
  createdAt: string;
  updatedAt: string;
  author: SessionUser;
  steel: string;
  steelName: string;
  abrasive: string;
  abrasiveName: string;
  abrasiveMaterial: string;
  bond: string;
  sharpnessMethodName: string;
  derived: {
    gritUm: number | null;
    gritStandard: string | null;
    gritGrade: string | null;
    gritBand: GritBand | null;
    hrc: number;
    perSideDeg: number;
    inclusiveDeg: number;
    sharpnessMedianG: number;
  };
  /** The last decision; `decision` may be the verb sent or the state it led to ("approved"). */
  review: { decision: string; note: string | null; at: string; by: { handle: string } | null } | null;
  can: { review: boolean; retract: boolean; edit: boolean };
}

export interface Result extends ResultSummary {
  hardness: { value: number; scale: HardnessScale; measured?: boolean };
  heatTreatment?: string | null;
  /** Steps before the final abrasive, with their derived µm (empty when none was recorded). */
  progression: { abrasive: string; abrasiveName: string; material: string; materialLabel: string; grit: { standard: GritStandard; grade: string }; gritUm: number; perSideDeg: number | null }[];
  grit: { standard?: GritStandard | null; grade: string } | null;
  edgeAngle: { perSideDeg: number } | { setup: WheelSetupValues };
  sharpness: { method: string; readingsG: number[] };
  retention: { method: string; cuts: number } | null;
  notes: RichTextNode | null;
  notesHtml: string;
  trail: TrailEntry[];
}

/** One changed field of a result revision against the version it replaces. */
export interface ResultFieldChange {
  path: string;
  label: string;
  before: string | null;
  after: string | null;
}

/** One revision of a result (GET /api/results/:id/revisions). */
export interface ResultRevision {
  number: number;
  status: 'applied' | 'pending' | 'approved' | 'returned' | 'rejected' | 'superseded';
  statusLabel: string;
  createdAt: string;
  author: { handle: string } | null;
  reviewedBy: { handle: string } | null;
  reviewedAt: string | null;
  note: string | null;
  replaces: number | null;
  changes: ResultFieldChange[];
}

/** A correction of a published result, waiting on the review desk. */
export interface DeskCorrection extends ResultRevision {
  kind: 'result-revision';
  result: Result;
  can: { review: boolean };
}

/** What PUT /api/results/:id answers: the result as it now stands and the revision it made. */
export interface ResultEdit {
  outcome: 'updated' | 'proposed';
  result: Result;
  revision: ResultRevision;
}

export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

export type SearchHitType = 'steel' | 'abrasive' | 'method' | 'result' | 'cell';

export interface SearchHit {
  type: SearchHitType;
  id?: number;
  slug?: string;
  title: string;
  snippet: string;
  score: number;
  /** For a comparison cell: its method, its name (steel:material:phi) and its figures (g). */
  cell?: { method: string; ref: string; n: number; testers: number; medianG: number; q1G: number; q3G: number };
}

export interface SearchResponse {
  hits: SearchHit[];
  facets: Record<SearchHitType, number>;
}

export interface Designation {
  system: string;
  code: string;
}

export interface SteelSummary {
  slug: string;
  name: string;
  category: string;
  designations: Designation[];
  hardnessHrc: { min: number; max: number } | null;
  resultCount: number;
}

export interface Citation {
  title: string;
  organisation: string;
  year: number | null;
  standard?: string;
  url?: string;
  supports: string;
}

export interface SteelDetail extends SteelSummary {
  composition: { element: string; min: number | null; max: number | null }[];
  body: RichTextNode | null;
  bodyHtml: string;
  citations: Citation[];
  revision: number | { id: number; at?: string; by?: { handle: string }; summary?: string } | null;
}

export interface AbrasiveSummary {
  slug: string;
  name: string;
  material: string;
  bond: string;
  form: string;
  grit: { standard: string; grade: string } | null;
  gritUm: number | null;
  wheelDiameterMm: number | null;
  wears: boolean;
  coolant: string;
  sideUsable: boolean;
  resultCount: number;
}

export interface AbrasiveDetail extends AbrasiveSummary {
  gritRange: { from: string; to: string } | string | null;
  widthMm: number | null;
  body: RichTextNode | null;
  bodyHtml: string;
  revision: SteelDetail['revision'];
}

export interface MethodSummary {
  slug: string;
  name: string;
  version: number | string;
  replacesSlug: string | null;
  instrument: string;
  medium: string;
  readingsPerEdge: number;
  retentionMedium: string | null;
  thresholdG: number | null;
}

export interface MethodDetail extends MethodSummary {
  body: RichTextNode | null;
  bodyHtml: string;
}
