import type { Actor } from '@shared/permissions';
import { can } from '@shared/permissions';
import { deriveResult } from '@shared/derive-result';
import type { ResultInput, ResultStatus } from '@shared/schemas/result';
import type { GritStandard } from '@shared/grit';
import type { AppContext } from '../context';
import { badRequest, forbidden, type FieldIssue } from '../errors';
import { Abrasive, Method, PAGE_TEXT_COLUMNS, Result, ResultEvent, Steel } from '../models';
import { renderRichText } from '../rich-text/render';
import { findResult } from '../queries/results';

/** Looks up the pages a result refers to by slug; every unknown slug is a field issue. */
async function resolveReferences(input: ResultInput): Promise<ResultReferences> {
  const attributes = { exclude: PAGE_TEXT_COLUMNS };
  const [steel, abrasive, sharpnessMethod, retentionMethod] = await Promise.all([
    Steel.findOne({ where: { slug: input.steel }, attributes }),
    Abrasive.findOne({ where: { slug: input.abrasive }, attributes }),
    Method.findOne({ where: { slug: input.sharpness.method }, attributes }),
    input.retention ? Method.findOne({ where: { slug: input.retention.method }, attributes }) : Promise.resolve(null),
  ]);
  const issues: FieldIssue[] = [];
  if (!steel) issues.push({ path: 'steel', message: `no steel page "${input.steel}"` });
  if (!abrasive) issues.push({ path: 'abrasive', message: `no abrasive page "${input.abrasive}"` });
  if (!sharpnessMethod) issues.push({ path: 'sharpness.method', message: `no method page "${input.sharpness.method}"` });
  if (input.retention && !retentionMethod) issues.push({ path: 'retention.method', message: `no method page "${input.retention.method}"` });
  if (issues.length) throw badRequest('Invalid input.', issues);
  return { steel: steel!, abrasive: abrasive!, sharpnessMethod: sharpnessMethod!, retentionMethod };
}

/** The pages a result refers to. */
export interface ResultReferences {
  steel: Steel;
  abrasive: Abrasive;
  sharpnessMethod: Method;
  retentionMethod: Method | null;
}

/** The stored row of a result: what was entered, its references and its derived values. */
export function resultRow(authorId: number, status: ResultStatus, input: ResultInput, refs: ResultReferences) {
  const derived = deriveResult(input, { standard: refs.abrasive.gritStandard as GritStandard, grade: refs.abrasive.gritGrade });
  return {
    authorId,
    status,
    steelId: refs.steel.id,
    abrasiveId: refs.abrasive.id,
    sharpnessMethodId: refs.sharpnessMethod.id,
    retentionMethodId: refs.retentionMethod?.id ?? null,
    input,
    material: refs.abrasive.material,
    hrc: derived.hrc,
    gritStandard: derived.gritStandard,
    gritGrade: derived.gritGrade,
    gritUm: derived.gritUm,
    gritPhi: derived.gritPhi,
    perSideDeg: derived.perSideDeg,
    inclusiveDeg: derived.inclusiveDeg,
    sharpnessMedianG: derived.sharpnessMedianG,
    retentionCuts: input.retention?.cuts ?? null,
    notesHtml: renderRichText(input.notes),
    approvedAt: null as Date | null,
  };
}

/**
 * Stores a member's result as `pending`, with its derived values and rendered notes, and
 * records the first step of its trail. Resolves after the commit with the result, with its trail.
 */
export async function submitResult(ctx: AppContext, actor: Actor, input: ResultInput): Promise<Result> {
  if (!can(actor, 'create:result')) throw forbidden();
  const row = resultRow(actor.id, 'pending', input, await resolveReferences(input));
  const id = await ctx.db.write(async (transaction) => {
    const result = await Result.create(row, { transaction });
    await ResultEvent.create({ resultId: result.id, actorId: actor.id, fromStatus: null, toStatus: 'pending', note: null }, { transaction });
    return result.id;
  });
  return findResult(id, actor);
}

