import type { Model, ModelStatic, Transaction } from 'sequelize';

type Listener = () => void;

/** A set of listeners, told after committed writes through some models. */
function writeEvent() {
  const listeners = new Set<Listener>();
  return {
    on(listener: Listener): () => void {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    notify(): void {
      for (const l of listeners) {
        try {
          l();
        } catch (err) {
          console.error('write events: a listener failed', err);
        }
      }
    },
  };
}

const pages = writeEvent();
const users = writeEvent();

/**
 * Calls `listener` after every committed write to a reference page, a page revision or a page
 * event (an edit, a proposal, a review, a protection, a merge, a new page). Caches of what pages
 * say or how they link follow this event. Returns a function that removes the listener.
 */
export const onPagesChanged = pages.on;

/** Calls `listener` after every committed write to an account (a role, a ban, a new member). */
export const onUsersChanged = users.on;

const HOOKS = ['afterCreate', 'afterUpdate', 'afterDestroy', 'afterBulkCreate', 'afterBulkUpdate', 'afterBulkDestroy', 'afterUpsert'] as const;

/**
 * Makes every write through `models` (single or bulk) call `notify`: after its transaction
 * commits, or at once outside one. Sequelize passes a hook's options last, whatever the hook.
 * Idempotent (named hooks), so models initialised twice in one process do not notify twice.
 */
function watch(models: ModelStatic<Model>[], name: string, notify: () => void): void {
  const changed = (options?: { transaction?: Transaction | null }) => {
    if (options?.transaction) options.transaction.afterCommit(notify);
    else notify();
  };
  for (const model of models) {
    for (const hook of HOOKS) {
      model.removeHook(hook, name);
      model.addHook(hook, name, (...args: unknown[]) => changed(args[args.length - 1] as { transaction?: Transaction | null }));
    }
  }
}

/** Ties the events above to the models they follow; called once the models are initialised. */
export function watchWrites(m: { pages: ModelStatic<Model>[]; users: ModelStatic<Model>[] }): void {
  watch(m.pages, 'pagesChanged', pages.notify);
  watch(m.users, 'usersChanged', users.notify);
}
