import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

/**
 * Page revisions numbered per page (issue 17): revision 1, 2, 3… of each steel, abrasive and
 * method page, in the order they were saved (id order), unique with the page. The id stays the
 * revision's identity in every route and write; the number is how people name it.
 *
 * The summaries the server wrote itself named revisions by id ("Reverted to revision 33",
 * "… (merged with revision 12)"); they are rewritten to name the same revisions by number, so
 * the history does not mix the two. A summary someone typed is left as it was.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('page_revisions', 'number', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  // Each revision's number: how many revisions of its page were saved up to it (itself included).
  await qi.sequelize.query(
    `UPDATE page_revisions SET "number" = (SELECT COUNT(*) FROM page_revisions earlier
       WHERE earlier."pageType" = page_revisions."pageType" AND earlier."pageId" = page_revisions."pageId" AND earlier.id <= page_revisions.id)`,
  );
  await qi.addIndex('page_revisions', ['pageType', 'pageId', 'number'], { unique: true, name: 'page_revisions_page_number' });
  await rewriteSummaries(qi, 'to numbers');
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await rewriteSummaries(qi, 'to ids');
  await qi.removeIndex('page_revisions', 'page_revisions_page_number');
  await qi.removeColumn('page_revisions', 'number');
}

interface Row { id: number; number: number; kind: string; summary: string; baseRevisionId: number | null; revertedFromId: number | null }

/** Rewrites the summaries the server wrote for reverts and merges from naming ids to numbers, or back. */
async function rewriteSummaries(qi: QueryInterface, direction: 'to numbers' | 'to ids') {
  const rows = await qi.sequelize.query<Row>(
    `SELECT id, "number", kind, summary, "baseRevisionId", "revertedFromId" FROM page_revisions`,
    { type: QueryTypes.SELECT },
  );
  const numberOf = new Map(rows.map((r) => [Number(r.id), Number(r.number)]));
  for (const r of rows) {
    const target = r.kind === 'revert' ? r.revertedFromId : r.kind === 'merge' ? r.baseRevisionId : null;
    if (target === null || !numberOf.has(Number(target))) continue;
    const [from, to] = direction === 'to numbers' ? [Number(target), numberOf.get(Number(target))!] : [numberOf.get(Number(target))!, Number(target)];
    const summary =
      r.kind === 'revert'
        ? r.summary === `Reverted to revision ${from}` ? `Reverted to revision ${to}` : null
        : r.summary.endsWith(` (merged with revision ${from})`) ? `${r.summary.slice(0, -` (merged with revision ${from})`.length)} (merged with revision ${to})` : null;
    if (summary !== null && summary !== r.summary) await qi.bulkUpdate('page_revisions', { summary }, { id: r.id });
  }
}
