import { median, summarize, type Summary } from './stats';

/** One approved result as it enters a comparison cell. */
export interface CellMember {
  authorId: number;
  /** The result's median sharpness reading, g (each result counts once). */
  sharpnessMedianG: number;
  retentionCuts: number | null;
  hrc: number;
  perSideDeg: number;
}

/** A comparison cell's aggregate figures. */
export interface CellAggregate {
  n: number;
  testers: number;
  sharpnessG: Summary;
  retentionMedianCuts: number | null;
  hrcRange: [number, number];
  angleRange: [number, number];
}

/** Aggregates the results of one cell: statistics of their medians, testers, ranges. */
export function aggregateCell(members: readonly CellMember[]): CellAggregate {
  const retention = members.map((m) => m.retentionCuts).filter((c): c is number => c !== null);
  const hrc = members.map((m) => m.hrc);
  const angle = members.map((m) => m.perSideDeg);
  return {
    n: members.length,
    testers: new Set(members.map((m) => m.authorId)).size,
    sharpnessG: summarize(members.map((m) => m.sharpnessMedianG)),
    retentionMedianCuts: retention.length ? median(retention) : null,
    hrcRange: [Math.min(...hrc), Math.max(...hrc)],
    angleRange: [Math.min(...angle), Math.max(...angle)],
  };
}
