import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GrinderInput, JigInput, SetupInput, WorkshopWheelInput } from '@shared/schemas/workshop';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** What each POST /api/workshop/<kind> takes. */
interface Inputs {
  grinders: GrinderInput;
  jigs: JigInput;
  setups: SetupInput;
  wheels: WorkshopWheelInput;
}

/** POST /api/workshop/{grinders,jigs,setups,wheels}: add one thing to the workshop, then refresh it. */
export function useAddToWorkshop<K extends keyof Inputs>(kind: K) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: Inputs[K]) => apiPost<{ id: number }>(`/api/workshop/${kind}`, input),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.wheels }),
  });
}
