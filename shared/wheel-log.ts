import { gapForAngle } from './geometry';

export interface WheelLogInput {
  originalDiameterMm: number;
  barDiameterMm: number;
  projectionMm: number;
  usualAnglesDeg: number[];
  /** Whether the wheel wears (vitrified, natural stone) or keeps its diameter (plated CBN, diamond). */
  wears: boolean;
  /** Measured diameters with their dates (ISO yyyy-mm-dd), any order. */
  measurements: { measuredOn: string; diameterMm: number }[];
}

export interface WheelLogSummary {
  currentDiameterMm: number;
  wearMm: number;
  /** Diameter lost per 30 days between the first and last measurement, mm; null with fewer than two dates. */
  wearPer30DaysMm: number | null;
  /** The gap from bar to rim that gives each usual angle on the wheel as it is now, mm (null where the setup cannot reach it). */
  gaps: { perSideDeg: number; gapMm: number | null; reason?: string }[];
  /** Measurements oldest first. */
  series: { measuredOn: string; diameterMm: number }[];
}

const DAY_MS = 24 * 3600 * 1000;

/** What a wheel log shows: current diameter, wear so far and its rate, and today's gaps for the usual angles. */
export function summarizeWheelLog(w: WheelLogInput): WheelLogSummary {
  const series = [...w.measurements].sort((a, b) => a.measuredOn.localeCompare(b.measuredOn));
  const current = series.length ? series[series.length - 1].diameterMm : w.originalDiameterMm;
  let wearPer30DaysMm: number | null = null;
  if (series.length >= 2) {
    const first = series[0];
    const last = series[series.length - 1];
    const days = (Date.parse(last.measuredOn) - Date.parse(first.measuredOn)) / DAY_MS;
    if (days > 0) wearPer30DaysMm = ((first.diameterMm - last.diameterMm) / days) * 30;
  }
  const gaps = w.usualAnglesDeg.map((perSideDeg) => {
    try {
      return { perSideDeg, gapMm: gapForAngle({ wheelDiameterMm: current, barDiameterMm: w.barDiameterMm, projectionMm: w.projectionMm, perSideDeg }).gapMm };
    } catch (err) {
      return { perSideDeg, gapMm: null, reason: err instanceof Error ? err.message : String(err) };
    }
  });
  return { currentDiameterMm: current, wearMm: w.originalDiameterMm - current, wearPer30DaysMm, gaps, series };
}
