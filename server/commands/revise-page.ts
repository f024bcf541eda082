import { Op, type Transaction } from 'sequelize';
import { can, type Actor } from '@shared/permissions';
import { deriveResult } from '@shared/derive-result';
import { parseGrit, type GritStandard } from '@shared/grit';
import { changedFields, mergeEdits } from '@shared/page-diff';
import { pageFieldsSchemas, splitEdit, type AbrasiveFields, type MethodFields, type PageContent, type PageEdit, type PageType, type SteelFields } from '@shared/schemas/pages';
import type { AppContext } from '../context';
import { badRequest, conflict, fieldIssues, forbidden, type FieldIssue } from '../errors';
import { Abrasive, Method, PageRevision, Result, Steel } from '../models';
import { contentOf, findPageOfType, findRevisionOf, survivorOf, type PageModel } from '../queries/pages';

/** What saving an edit came to: live at once, proposed for review, or refused as stale (nothing written). */
export type ReviseOutcome =
  | { outcome: 'live' | 'proposed'; revision: PageRevision; page: PageModel }
  | {
      outcome: 'stale';
      page: PageModel;
      /** The page's current revision, saved after the editor's base. */
      current: PageRevision;
      /** Fields (and 'body') both the editor and the later revision changed, differently. */
      conflicts: string[];
      /** The editor's changes laid over the current revision where they do not conflict. */
      merged: PageContent;
    };

/**
 * Checks a revision's content against its page type's schema once more before it is applied:
 * merged and reverted contents are built on the server and must hold to the same rules.
 */
function validContent(type: PageType, content: PageContent): PageContent {
  const parsed = pageFieldsSchemas[type].safeParse(content.fields);
  if (!parsed.success) throw badRequest('These fields do not make a valid page.', fieldIssues(parsed.error));
  return { fields: parsed.data as Record<string, unknown>, body: content.body };
}

/**
 * A designation names one steel: a second page claiming "EN 1.2379" is a duplicate, which a
 * moderator merges rather than two pages drifting apart. Throws 400 naming the designation.
 */
export async function checkDesignationsFree(page: PageModel | null, fields: SteelFields, transaction: Transaction) {
  const where = page ? { id: { [Op.ne]: page.id }, mergedIntoId: null } : { mergedIntoId: null };
  const others = await Steel.findAll({ where, attributes: ['slug', 'name', 'designations'], transaction });
  const issues: FieldIssue[] = [];
  fields.designations.forEach((d, i) => {
    const owner = others.find((o) => o.designations.some((x) => x.system === d.system && x.code.toLowerCase() === d.code.toLowerCase()));
    if (owner) issues.push({ path: `designations.${i}.code`, message: `${d.system} ${d.code} is already on the page "${owner.name}" (${owner.slug}); ask a moderator to merge the pages` });
  });
  if (issues.length) throw badRequest('A designation belongs to another steel page.', issues);
}

/**
 * Re-derives the stored grit and material of every result on an abrasive after its page
 * changed them (a result without its own grit takes the abrasive's); the comparison cells those
 * results leave and enter follow with the change feed. Returns how many results changed.
 */
async function rederiveAbrasiveResults(abrasive: Abrasive, transaction: Transaction): Promise<number> {
  const rows = await Result.findAll({ where: { abrasiveId: abrasive.id }, transaction });
  let changed = 0;
  for (const r of rows) {
    const d = deriveResult(r.input, { standard: abrasive.gritStandard as GritStandard, grade: abrasive.gritGrade });
    const next = { material: abrasive.material, gritStandard: d.gritStandard, gritGrade: d.gritGrade, gritUm: d.gritUm, gritPhi: d.gritPhi };
    if (r.material === next.material && r.gritStandard === next.gritStandard && r.gritGrade === next.gritGrade && r.gritUm === next.gritUm && r.gritPhi === next.gritPhi) continue;
    await r.update(next, { transaction });
    changed += 1;
  }
  return changed;
}

const steelColumns = (f: SteelFields) => ({
  name: f.name, category: f.category, designations: f.designations, composition: f.composition,
  hardnessMinHrc: f.hardnessHrc?.min ?? null, hardnessMaxHrc: f.hardnessHrc?.max ?? null,
  citations: f.citations, sources: f.sources as Record<string, number>,
});

const abrasiveColumns = (f: AbrasiveFields) => {
  const grit = parseGrit(f.grit.grade, f.grit.standard);
  return {
    name: f.name, material: f.material, bond: f.bond, form: f.form,
    gritStandard: grit.standard, gritGrade: grit.grade, gritUm: grit.micrometres, gritRange: f.gritRange,
    wheelDiameterMm: f.wheelDiameterMm, widthMm: f.widthMm, wears: f.wears, coolant: f.coolant, sideUsable: f.sideUsable,
    priceNote: f.priceNote, citations: f.citations, sources: f.sources as Record<string, number>,
  };
};

const methodColumns = (f: MethodFields) => ({
  name: f.name, instrument: f.instrument, medium: f.medium, readingsPerEdge: f.readingsPerEdge,
  retentionMedium: f.retentionMedium, thresholdG: f.thresholdG, citations: f.citations, sources: f.sources as Record<string, number>,
});

interface PageColumns {
  steel: ReturnType<typeof steelColumns>;
  abrasive: ReturnType<typeof abrasiveColumns>;
  method: ReturnType<typeof methodColumns>;
}

/**
 * A page's columns as its fields and body give them (an abrasive's grit parsed to µm), after
 * checking the content against its page type's schema once more.
 */
export function columnsOf<T extends PageType>(type: T, content: PageContent): PageColumns[T] & { body: PageContent['body'] } {
  const { fields, body } = validContent(type, content);
  const columns = type === 'steel' ? steelColumns(fields as SteelFields) : type === 'abrasive' ? abrasiveColumns(fields as AbrasiveFields) : methodColumns(fields as MethodFields);
  return { ...(columns as PageColumns[T]), body };
}

/**
 * Makes `content` the page's current state, from revision `revisionId`, inside the caller's
 * transaction: the page's columns follow the revision's fields, and an abrasive whose material or
 * grit changed re-derives its results and their cells.
 */
export async function applyContent(type: PageType, page: PageModel, content: PageContent, revisionId: number, transaction: Transaction): Promise<void> {
  if (type === 'steel') {
    const columns = columnsOf('steel', content);
    await checkDesignationsFree(page, content.fields as SteelFields, transaction);
    await (page as Steel).update({ ...columns, currentRevisionId: revisionId }, { transaction });
    return;
  }
  if (type === 'abrasive') {
    const a = page as Abrasive;
    const columns = columnsOf('abrasive', content);
    const gritChanged = a.material !== columns.material || a.gritStandard !== columns.gritStandard || a.gritGrade !== columns.gritGrade;
    await a.update({ ...columns, currentRevisionId: revisionId }, { transaction });
    if (gritChanged) await rederiveAbrasiveResults(a, transaction);
    return;
  }
  await (page as Method).update({ ...columnsOf('method', content), currentRevisionId: revisionId }, { transaction });
}

/** Fields whose change alters how results on the page are titled or found. */
export const RESULT_VISIBLE_FIELDS = ['name', 'designations', 'material', 'grit'];

/** Refuses an edit of a page that was merged away, naming the page that survives. */
export async function refuseIfMerged(type: PageType, page: PageModel): Promise<void> {
  if (!page.mergedIntoId) return;
  const survivor = await survivorOf(type, page);
  throw conflict(`This page was merged into "${survivor?.name ?? 'another page'}"${survivor ? ` (${survivor.slug})` : ''}; edit that page instead.`);
}

/**
 * Saves an edit of a page as a new revision. The edit names the revision it started from; when
 * another revision became current in the meantime nothing is written and the outcome is
 * 'stale', with the current revision, the conflicting fields and a suggested merge. Otherwise a
 * moderator's or publisher's edit goes live at once (the page follows it, the search index
 * with the change feed) and a member's is stored as a proposal for the review desk. Protected pages take
 * edits from moderators only. An edit that changes nothing is refused.
 */
export async function revisePage(ctx: AppContext, actor: Actor, type: PageType, slug: string, edit: PageEdit): Promise<ReviseOutcome> {
  const { base, summary, content } = splitEdit(type, edit);
  const outcome = await ctx.db.write(async (transaction): Promise<ReviseOutcome> => {
    const page = await findPageOfType(type, slug, transaction);
    await refuseIfMerged(type, page);
    const subject = { isProtected: page.isProtected };
    if (!can(actor, 'edit:page', subject)) throw forbidden('This page is protected: only moderators edit it.');
    const baseRevision = await findRevisionOf(type, page.id, base, transaction).catch(() => {
      throw badRequest('Invalid input.', [{ path: 'baseRevision', message: `no revision of this page has the id ${base}` }]);
    });
    if (baseRevision.status !== 'live') {
      throw badRequest('Invalid input.', [{ path: 'baseRevision', message: `revision ${baseRevision.number} of this page (id ${base}) was never live; start from the page as it is` }]);
    }
    if (page.currentRevisionId !== base) {
      const current = await findRevisionOf(type, page.id, page.currentRevisionId!, transaction);
      const merge = mergeEdits(type, contentOf(baseRevision), content, contentOf(current));
      return { outcome: 'stale', page, current, conflicts: merge.conflicts, merged: merge.content };
    }
    if (changedFields(type, contentOf(baseRevision), content).length === 0) {
      throw badRequest(`Nothing changed: the fields and text are the same as revision ${baseRevision.number}.`, [{ path: '(body)', message: 'change something before saving' }]);
    }
    // Validates before anything is written, also for proposals (a proposal must be applicable).
    validContent(type, content);
    if (type === 'steel') await checkDesignationsFree(page, content.fields as SteelFields, transaction);
    const live = can(actor, 'publish:page', subject);
    const revision = await PageRevision.create(
      { pageType: type, pageId: page.id, authorId: actor.id, summary, fields: content.fields, body: content.body, status: live ? 'live' : 'proposed', kind: 'edit', baseRevisionId: base },
      { transaction },
    );
    if (live) await applyContent(type, page, content, revision.id, transaction);
    return { outcome: live ? 'live' : 'proposed', revision, page };
  });
  return outcome;
}
