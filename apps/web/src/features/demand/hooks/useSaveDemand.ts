import type { PutUnitDemandRequest } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { demandKeys, putUnitDemand } from '../api/demand.queries';

/** Saves both parts of a unit's demand; the unit's forecast and every computed plan are read again. */
export function useSaveDemand(unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PutUnitDemandRequest) => putUnitDemand(unitId, body),
    onSuccess: (saved) => {
      queryClient.setQueryData(demandKeys.unit(unitId), saved);
      void queryClient.invalidateQueries({ queryKey: demandKeys.plans });
    },
  });
}
