import { atLeast, can, type Actor } from '@shared/permissions';
import { bandOfPhi } from '@shared/derive-result';
import { ABRASIVE_MATERIALS, REVISION_STATUS_LABELS } from '@shared/vocabulary';
import { resultChanges } from '@shared/result-diff';
import type { ResultInput } from '@shared/schemas/result';
import type { Result, ResultRevision, SummarisableResult } from '../models';
import { presentAccount } from './user';

/** Abrasive pages' names by slug (the route reads them with `abrasiveNames()`): a progression step names its abrasive by slug. */
export type AbrasiveNames = ReadonlyMap<string, string>;

const round = (x: number, digits = 2) => Math.round(x * 10 ** digits) / 10 ** digits;

/** The trail, oldest first, and the last decision in it (unless the result went back on the desk after it: edited and resubmitted). */
function trailOf(result: SummarisableResult) {
  const events = [...(result.events ?? [])].sort((a, b) => a.id - b.id);
  const lastDecision = events.findLastIndex((e) => e.fromStatus === 'pending' && e.toStatus !== 'pending');
  const decision = lastDecision >= 0 && !events.slice(lastDecision + 1).some((e) => e.toStatus === 'pending') ? events[lastDecision] : undefined;
  return { events, decision };
}

const isInsider = (result: SummarisableResult, viewer: Actor | null) => !!viewer && (viewer.id === result.authorId || atLeast(viewer.role, 'moderator'));

/**
 * A result in a list (GET /results): what a list shows of it (its pages, figures, author, date,
 * state, the review note for its author and moderators, the viewer's actions), without what was
 * entered in full, the notes or the trail, which its own answer (presentResult) gives.
 */
export function presentResultSummary(result: SummarisableResult, viewer: Actor | null) {
  const { decision } = trailOf(result);
  return {
    id: result.id,
    status: result.status,
    createdAt: result.createdAt,
    updatedAt: result.updatedAt,
    author: result.author ? presentAccount(result.author) : null,
    steel: result.steel?.slug ?? '',
    steelName: result.steel?.name ?? '',
    abrasive: result.abrasive?.slug ?? '',
    abrasiveName: result.abrasive?.name ?? '',
    abrasiveMaterial: result.material,
    abrasiveMaterialLabel: ABRASIVE_MATERIALS[result.material as keyof typeof ABRASIVE_MATERIALS] ?? result.material,
    bond: result.abrasive?.bond ?? null,
    sharpnessMethodName: result.sharpnessMethod?.name ?? '',
    derived: {
      gritUm: round(result.gritUm, 3),
      gritStandard: result.gritStandard,
      gritGrade: result.gritGrade,
      gritBand: bandOfPhi(result.gritPhi),
      hrc: round(result.hrc, 1),
      perSideDeg: round(result.perSideDeg),
      inclusiveDeg: round(result.inclusiveDeg),
      sharpnessMedianG: round(result.sharpnessMedianG),
    },
    review:
      isInsider(result, viewer) && decision
        ? { decision: decision.toStatus, note: decision.note, at: decision.createdAt, by: decision.actor ? { handle: decision.actor.handle } : null }
        : null,
    can: {
      review: can(viewer, 'review:result', { authorId: result.authorId, status: result.status }) && result.status === 'pending',
      retract: can(viewer, 'retract:result', { authorId: result.authorId, status: result.status }),
      edit: can(viewer, 'edit:result', { authorId: result.authorId, status: result.status }),
    },
  };
}

/**
 * A result as the API gives it: the summary, with what was entered (the pages as entered), the
 * progression, the notes, and, for its author and moderators only, the trail.
 */
export function presentResult(result: Result, viewer: Actor | null, names: AbrasiveNames) {
  const input = result.input;
  const { events } = trailOf(result);
  return {
    ...presentResultSummary(result, viewer),
    steel: input.steel,
    steelName: result.steel?.name ?? input.steel,
    hardness: input.hardness,
    heatTreatment: input.heatTreatment,
    /** The steps before the final abrasive, as stored with their derived sizes, each with its abrasive's name. */
    progression: (result.progression ?? []).map((s) => ({
      abrasive: s.abrasive,
      abrasiveName: names.get(s.abrasive) ?? s.abrasive,
      material: s.material,
      materialLabel: ABRASIVE_MATERIALS[s.material as keyof typeof ABRASIVE_MATERIALS] ?? s.material,
      grit: { standard: s.gritStandard, grade: s.gritGrade },
      gritUm: round(s.gritUm, 3),
      perSideDeg: s.perSideDeg,
    })),
    abrasive: input.abrasive,
    abrasiveName: result.abrasive?.name ?? input.abrasive,
    grit: input.grit ?? null,
    edgeAngle: input.edgeAngle,
    sharpness: input.sharpness,
    sharpnessMethodName: result.sharpnessMethod?.name ?? input.sharpness.method,
    retention: input.retention ?? null,
    notes: input.notes ?? null,
    notesHtml: result.notesHtml,
    trail: isInsider(result, viewer)
      ? events.map((e) => ({ from: e.fromStatus, to: e.toStatus, at: e.createdAt, by: e.actor ? { handle: e.actor.handle } : null, note: e.note }))
      : [],
  };
}
export type PresentedResult = ReturnType<typeof presentResult>;

/**
 * One revision of a result: its number and state, who wrote and who decided it, what was
 * entered, and the changes against the version it replaces (`replaces`, null for the first).
 */
export function presentResultRevision(revision: ResultRevision, replaces: ResultRevision | { number: null; input: ResultInput } | null) {
  return {
    number: revision.number,
    status: revision.status,
    statusLabel: REVISION_STATUS_LABELS[revision.status],
    createdAt: revision.createdAt,
    author: revision.author ? { handle: revision.author.handle } : null,
    reviewedBy: revision.reviewer ? { handle: revision.reviewer.handle } : null,
    reviewedAt: revision.reviewedAt,
    note: revision.note,
    input: revision.input,
    replaces: replaces?.number ?? null,
    changes: replaces ? resultChanges(replaces.input, revision.input) : [],
  };
}
export type PresentedResultRevision = ReturnType<typeof presentResultRevision>;

/**
 * Corrections of published results waiting for a moderator: each with the published result it
 * would change, the changes against it, and whether the viewer may decide it.
 */
export function presentPendingRevisions(pending: { revision: ResultRevision; result: Result }[], viewer: Actor, names: AbrasiveNames) {
  return pending.map(({ revision, result }) => ({
    kind: 'result-revision' as const,
    ...presentResultRevision(revision, { number: null, input: result.input }),
    result: presentResult(result, viewer, names),
    can: { review: can(viewer, 'review:result', { authorId: revision.authorId, status: revision.status }) },
  }));
}
