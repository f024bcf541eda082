// Placeholder signatures; the full implementation replaces this file.
export interface WheelSetup { wheelDiameterMm: number; barDiameterMm: number; gapMm: number; projectionMm: number }
export function angleFromSetup(s: WheelSetup): { perSideDeg: number; inclusiveDeg: number } {
  const R = s.wheelDiameterMm / 2; const d = R + s.gapMm + s.barDiameterMm / 2; const L = s.projectionMm;
  const deg = (Math.asin((d * d - R * R - L * L) / (2 * R * L)) * 180) / Math.PI;
  return { perSideDeg: deg, inclusiveDeg: 2 * deg };
}
