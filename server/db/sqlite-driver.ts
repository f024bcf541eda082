import sqlite3 from 'sqlite3';

export interface PragmaSettings {
  synchronous: 'NORMAL' | 'FULL';
  busyTimeoutMs: number;
}

/**
 * The sqlite3 module with a Database class that sets the project's PRAGMAs on every connection
 * it opens, before anyone can use it. Sequelize opens one connection per transaction and its
 * connection hooks never fire for SQLite, so a PRAGMA sent once through `sequelize.query`
 * would reach only the default connection; handing Sequelize this module as `dialectModule`
 * covers them all.
 */
export function sqliteWithPragmas(settings: PragmaSettings): typeof sqlite3 {
  const pragmas = [
    'PRAGMA journal_mode = WAL;',
    `PRAGMA synchronous = ${settings.synchronous};`,
    `PRAGMA busy_timeout = ${Math.round(settings.busyTimeoutMs)};`,
    'PRAGMA foreign_keys = ON;',
  ].join('\n');

  class Database extends sqlite3.Database {
    constructor(filename: string, mode?: number | ((err: Error | null) => void), callback?: (err: Error | null) => void) {
      const cb = typeof mode === 'function' ? mode : callback;
      const openMode = typeof mode === 'number' ? mode : sqlite3.OPEN_READWRITE | sqlite3.OPEN_CREATE;
      super(filename, openMode, (err) => {
        if (err) return cb?.(err);
        this.exec(pragmas, (pragmaErr) => cb?.(pragmaErr ?? null));
      });
    }
  }
  return { ...sqlite3, Database } as typeof sqlite3;
}
