import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CoolantChange, kitSharpeningCost, SetupSetting, SharpeningCost } from '@shared/workshop';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export interface WorkshopGrinderView {
  id: number;
  name: string;
  spindleRpm: number;
  barDiameterMm: number;
  barMount: string;
  pricePaid: number | null;
  currency: string | null;
}

export interface WorkshopWheelView {
  id: number;
  name: string;
  abrasive: { slug: string; name: string; sideUsable: boolean; grit: string; gritUm: number } | null;
  grinderId: number | null;
  wears: boolean;
  originalDiameterMm: number;
  minDiameterMm: number | null;
  currentDiameterMm: number;
  ratedSpeedMps: number | null;
  speed: { speedMps: number; ratedSpeedMps: number; overspeed: boolean; marginPct: number } | null;
  coolant: string | null;
  acquiredOn: string | null;
  pricePaid: number | null;
  currency: string | null;
  retiredOn: string | null;
  retiredAfterSharpenings: number | null;
  measurements: { id: number; measuredOn: string; diameterMm: number; dressed: boolean; sharpenings: number }[];
  forecast: { onDate: string; mmPer30Days: number; points: number } | null;
  cost: SharpeningCost | null;
}

/** GET /api/workshop: the signed-in member's own workshop. */
export interface Workshop {
  grinders: WorkshopGrinderView[];
  jigs: { id: number; name: string; offsetMm: number }[];
  setups: { id: number; name: string; jigId: number | null; projectionMm: number; perSideDeg: number; settings: Omit<SetupSetting, 'setupId'>[] }[];
  wheels: WorkshopWheelView[];
  kit: {
    totals: { currency: string; wheelsTotal: number; wheelCount: number; machinesTotal: number }[];
    perSharpening: ReturnType<typeof kitSharpeningCost>;
    coolant: { order: number[]; changes: CoolantChange[]; suggestedOrder: number[]; suggestedChanges: CoolantChange[] };
  };
}

export const workshopQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.workshop,
    queryFn: ({ signal }) => apiGet<Workshop>('/api/workshop', {}, signal),
  });

export function useWorkshop(enabled: boolean) {
  return useQuery({ ...workshopQueryOptions(), enabled });
}
