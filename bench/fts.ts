/**
 * The yardstick the search is held to: SQLite FTS5 over the very same documents, asked the very
 * same queries in-process (no HTTP), every word required and the last one as a prefix, as in the
 * app, with bm25 weighting title and names 3 to the body's 1 (the index's boosts), and the hits
 * counted by type as the app's facets are. Used by bench/compare.ts and bench/load.ts.
 */
import sqlite3 from 'sqlite3';
import { titleOf, type SearchDoc } from '../server/search/search-index';

/** Each query's time, ms, in the order given. */
export async function ftsTimes(docs: AsyncIterable<SearchDoc> | Iterable<SearchDoc>, queries: string[]): Promise<number[]> {
  const fts = new sqlite3.Database(':memory:');
  const run = (sql: string, params: unknown[] = []) => new Promise<void>((resolve, reject) => fts.run(sql, params, (err) => (err ? reject(err) : resolve())));
  const all = (sql: string, params: unknown[] = []) => new Promise<unknown[]>((resolve, reject) => fts.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows))));
  try {
    await run("CREATE VIRTUAL TABLE docs USING fts5(key UNINDEXED, type UNINDEXED, title, names, body, tokenize = 'unicode61')");
    await run('BEGIN');
    for await (const d of docs) await run('INSERT INTO docs VALUES (?, ?, ?, ?, ?)', [d.key, d.type, titleOf(d), d.names, d.body]);
    await run('COMMIT');
    const times: number[] = [];
    for (const q of queries) {
      const words = q.toLowerCase().split(/\s+/).filter(Boolean);
      const match = words.map((w, i) => `"${w.replace(/"/g, '""')}"${i === words.length - 1 ? '*' : ''}`).join(' AND ');
      const s = performance.now();
      await all('SELECT key, type, bm25(docs, 3.0, 3.0, 1.0) AS score FROM docs WHERE docs MATCH ? ORDER BY score LIMIT 30', [match]);
      await all('SELECT type, COUNT(*) FROM docs WHERE docs MATCH ? GROUP BY type', [match]);
      times.push(performance.now() - s);
    }
    return times;
  } finally {
    await new Promise<void>((resolve) => fts.close(() => resolve()));
  }
}
