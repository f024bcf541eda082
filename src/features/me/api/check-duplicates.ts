import type { ResultInput } from '@shared/schemas/result';
import { apiPost } from '@/lib/api-client';

/** An earlier result of one's own that a new one repeats. */
export interface Duplicate {
  id: number;
  status: string;
  createdAt: string;
}

/** POST /api/me/duplicate-check: one's own results with the same steel, abrasive, grit, angle and readings. */
export async function checkDuplicates(input: ResultInput): Promise<Duplicate[]> {
  return (await apiPost<{ duplicates: Duplicate[] }>('/api/me/duplicate-check', input)).duplicates;
}
