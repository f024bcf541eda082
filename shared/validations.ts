/** Limits used by both the server's validation and the client's forms. */
export const limits = {
  slugMax: 80,
  handleMax: 40,
  readingsMax: 50,
  readingGMax: 10_000,
  cutsMax: 1_000_000,
  noteMax: 2_000,
  richTextMaxDepth: 12,
  richTextMaxNodes: 5_000,
  richTextMaxChars: 50_000,
  searchQueryMax: 200,
  /** Hits of each kind a search with no kind asked for brings beside the best overall ("All" shows them). */
  searchSectionBest: 5,
  pageSize: 25,
} as const;
