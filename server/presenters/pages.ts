import { renderRichText } from '../rich-text/render';
import type { Abrasive, Method, Steel } from '../models';

/** A steel in a list. */
export function presentSteelSummary(steel: Steel, resultCount: number) {
  return {
    slug: steel.slug,
    name: steel.name,
    category: steel.category,
    designations: steel.designations,
    hardnessHrc: steel.hardnessMinHrc !== null && steel.hardnessMaxHrc !== null ? { min: steel.hardnessMinHrc, max: steel.hardnessMaxHrc } : null,
    resultCount,
  };
}

/** A steel's whole page. */
export function presentSteel(steel: Steel, resultCount: number) {
  return {
    ...presentSteelSummary(steel, resultCount),
    composition: steel.composition,
    body: steel.body,
    bodyHtml: renderRichText(steel.body),
    citations: steel.citations,
    revision: steel.currentRevisionId,
  };
}

/** An abrasive in a list. */
export function presentAbrasiveSummary(a: Abrasive, resultCount: number) {
  return {
    slug: a.slug,
    name: a.name,
    material: a.material,
    bond: a.bond,
    form: a.form,
    grit: { standard: a.gritStandard, grade: a.gritGrade },
    gritUm: a.gritUm,
    wheelDiameterMm: a.wheelDiameterMm,
    wears: a.wears,
    coolant: a.coolant,
    sideUsable: a.sideUsable,
    resultCount,
  };
}

/** An abrasive's whole page. */
export function presentAbrasive(a: Abrasive, resultCount: number) {
  return {
    ...presentAbrasiveSummary(a, resultCount),
    gritRange: a.gritRange,
    widthMm: a.widthMm,
    body: a.body,
    bodyHtml: renderRichText(a.body),
    citations: a.citations,
    revision: a.currentRevisionId,
  };
}

/** A method in a list; `replacesSlug` links a version to the one it replaces. */
export function presentMethodSummary(m: Method, slugById: Map<number, string>) {
  return {
    slug: m.slug,
    name: m.name,
    version: m.version,
    replacesSlug: m.replacesId ? (slugById.get(m.replacesId) ?? null) : null,
    instrument: m.instrument,
    medium: m.medium,
    readingsPerEdge: m.readingsPerEdge,
    retentionMedium: m.retentionMedium,
    thresholdG: m.thresholdG,
  };
}

/** A method's whole page. */
export function presentMethod(m: Method, slugById: Map<number, string>) {
  return { ...presentMethodSummary(m, slugById), body: m.body, bodyHtml: renderRichText(m.body), citations: m.citations, revision: m.currentRevisionId };
}
