import { ABRASIVE_MATERIALS } from '@shared/vocabulary';

/**
 * The owners a result or comparison cell takes its words from in the search index (see
 * SearchIndex): one key per page or member, and the words it lends. Every document that refers
 * to the same owner must lend it the same words, so each is built here, once.
 */
export interface SearchOwner {
  key: string;
  words: string;
  /** What a result's title calls it: the steel's, abrasive's or method's name, the member's handle. */
  label: string;
}

/** A steel: its name and every designation, with its system ("AISI D2", "WNr 1.2379"). */
export const steelOwner = (steel: { id: number; name: string; designations: { system: string; code: string }[] }): SearchOwner => ({
  key: `steel:${steel.id}`,
  words: [steel.name, ...steel.designations.map((d) => `${d.system} ${d.code}`)].join(' '),
  label: steel.name,
});

/** An abrasive at one grit: its name, material and grit grade with its size. */
export const abrasiveOwner = (abrasive: { id: number; name: string }, grit: { material: string; gritGrade: string; gritUm: number }): SearchOwner => ({
  key: `abrasive:${abrasive.id}:${grit.gritGrade}`,
  words: [abrasive.name, ABRASIVE_MATERIALS[grit.material as keyof typeof ABRASIVE_MATERIALS] ?? grit.material, grit.material, grit.gritGrade, `${Math.round(grit.gritUm * 10) / 10} µm`].join(' '),
  label: abrasive.name,
});

/** A method: its name and version. */
export const methodOwner = (method: { id: number; name: string; version: number }): SearchOwner => ({
  key: `method:${method.id}`,
  words: `${method.name} v${method.version}`,
  label: method.name,
});

/** A member: their handle. */
export const memberOwner = (user: { id: number; handle: string }): SearchOwner => ({ key: `member:${user.id}`, words: user.handle, label: user.handle });
