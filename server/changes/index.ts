/**
 * The change feed: every write transaction records what it changed (`record`), the feed writes it
 * to the `changes` table in that transaction and hands it to every follower after the commit.
 */
export { record, ChangeFeed } from './feed';
export { follow, tellFollowers, type Dispatched, type Stage } from './followers';
export { KEPT, type Kept } from './kept';
export { resultsChanged, cellId, ROW_KINDS, type Change, type ChangeKind, type CellKey, type PageChange, type ResultState, type Topic } from './kinds';
