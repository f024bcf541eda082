import { can } from '@shared/permissions';
import { deriveResult } from '@shared/derive-result';
import { deriveProgression, progressionColumns } from '@shared/progression';
import type { ResultInput, ResultStatus } from '@shared/schemas/result';
import type { GritStandard } from '@shared/grit';
import { isRetentionMethod } from '@shared/vocabulary';
import type { AppContext } from '../context';
import { badRequest, forbidden, type FieldIssue } from '../errors';
import { Abrasive, Method, PAGE_TEXT_COLUMNS, Result, ResultEvent, Steel, type User } from '../models';
import { keptUntil } from '../queries/kept-until';
import type { Database } from '../db/database';
import { GroupCommit } from '../db/group-commit';
import { insertRows } from '../db/insert-rows';
import { renderRichText } from '../rich-text/render';

/**
 * The pages results refer to, by type and slug, without their long columns, kept until a page
 * changes: every submission names three or four of them. Shared, so never changed by a caller.
 */
const pageRefs = keptUntil<string, Steel | Abrasive | Method | null>('pageRefs');
function pageRef<T extends typeof Steel | typeof Abrasive | typeof Method>(model: T, slug: string): Promise<InstanceType<T> | null> {
  const find = () => (model as typeof Steel).findOne({ where: { slug }, attributes: { exclude: PAGE_TEXT_COLUMNS } });
  return pageRefs.read(`${model.name}:${slug}`, find) as Promise<InstanceType<T> | null>;
}

/** Looks up the pages a result refers to by slug; every unknown slug is a field issue. */
export async function resolveReferences(input: ResultInput): Promise<ResultReferences> {
  const steps = input.progression ?? [];
  const [steel, abrasive, sharpnessMethod, retentionMethod, ...stepPages] = await Promise.all([
    pageRef(Steel, input.steel),
    pageRef(Abrasive, input.abrasive),
    pageRef(Method, input.sharpness.method),
    input.retention ? pageRef(Method, input.retention.method) : Promise.resolve(null),
    ...steps.map((s) => pageRef(Abrasive, s.abrasive)),
  ]);
  const issues: FieldIssue[] = [];
  const stepAbrasives = new Map<string, Abrasive>();
  steps.forEach((s, i) => {
    const page = stepPages[i] as Abrasive | null;
    if (page) stepAbrasives.set(s.abrasive, page);
    else issues.push({ path: `progression.${i}.abrasive`, message: `no abrasive page "${s.abrasive}"` });
  });
  if (!steel) issues.push({ path: 'steel', message: `no steel page "${input.steel}"` });
  if (!abrasive) issues.push({ path: 'abrasive', message: `no abrasive page "${input.abrasive}"` });
  if (!sharpnessMethod) issues.push({ path: 'sharpness.method', message: `no method page "${input.sharpness.method}"` });
  if (input.retention && !retentionMethod) issues.push({ path: 'retention.method', message: `no method page "${input.retention.method}"` });
  if (sharpnessMethod && isRetentionMethod(sharpnessMethod)) {
    issues.push({ path: 'sharpness.method', message: `"${input.sharpness.method}" is a retention method; choose a sharpness method` });
  }
  if (input.retention && retentionMethod && !isRetentionMethod(retentionMethod)) {
    issues.push({ path: 'retention.method', message: `"${input.retention.method}" defines no retention medium; choose a retention method` });
  }
  if (issues.length) throw badRequest('Invalid input.', issues);
  return { steel: steel!, abrasive: abrasive!, sharpnessMethod: sharpnessMethod!, retentionMethod, stepAbrasives };
}

/** The pages a result refers to. */
export interface ResultReferences {
  steel: Steel;
  abrasive: Abrasive;
  sharpnessMethod: Method;
  retentionMethod: Method | null;
  /** The progression's abrasive pages by slug. */
  stepAbrasives: Map<string, Abrasive>;
}

/** The stored row of a result: what was entered, its references and its derived values. */
export function resultRow(authorId: number, status: ResultStatus, input: ResultInput, refs: ResultReferences) {
  const derived = deriveResult(input, { standard: refs.abrasive.gritStandard as GritStandard, grade: refs.abrasive.gritGrade });
  const progression = deriveProgression(input.progression, (slug) => refs.stepAbrasives.get(slug)!);
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
    progression,
    ...progressionColumns(progression),
    notesHtml: renderRichText(input.notes),
    approvedAt: null as Date | null,
  };
}

type ResultRow = ReturnType<typeof resultRow>;

/**
 * New results go in by group commit: those posted while another write runs are inserted
 * together, with the first step of each one's trail, in one transaction.
 */
const submissions = new WeakMap<Database, GroupCommit<ResultRow, { result: Result; event: ResultEvent }>>();
function submissionsOf(db: Database) {
  let group = submissions.get(db);
  if (!group) {
    group = new GroupCommit(db, async (rows, transaction) => {
      const results = await insertRows(Result, rows, transaction);
      const events = await insertRows(
        ResultEvent,
        results.map((r) => ({ resultId: r.id, actorId: r.authorId, fromStatus: null, toStatus: 'pending' as const, note: null })),
        transaction,
      );
      return results.map((result, i) => ({ result, event: events[i] }));
    });
    submissions.set(db, group);
  }
  return group;
}

/**
 * Stores `author`'s result as `pending`, with its derived values and rendered notes, and
 * records the first step of its trail. Resolves after the commit with the result, with its
 * pages, author and trail as a read would give them (they are all at hand, so none is read again).
 */
export async function submitResult(ctx: AppContext, author: User, input: ResultInput): Promise<Result> {
  const actor = author.asActor();
  if (!can(actor, 'create:result')) throw forbidden();
  const refs = await resolveReferences(input);
  const { result, event } = await submissionsOf(ctx.db).add(resultRow(actor.id, 'pending', input, refs));
  event.actor = author;
  return Object.assign(result, { author, steel: refs.steel, abrasive: refs.abrasive, sharpnessMethod: refs.sharpnessMethod, retentionMethod: refs.retentionMethod ?? undefined, events: [event] });
}
