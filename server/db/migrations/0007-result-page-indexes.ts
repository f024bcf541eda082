import type { QueryInterface } from 'sequelize';

/**
 * Covering indexes for the approved-result counts on steel and abrasive pages and lists, which
 * otherwise scan every result (measured at 100 000 results: a steel page at 2 requests/s).
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('results', ['status', 'steelId'], { name: 'results_status_steel' });
  await qi.addIndex('results', ['status', 'abrasiveId'], { name: 'results_status_abrasive' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('results', 'results_status_steel');
  await qi.removeIndex('results', 'results_status_abrasive');
}
