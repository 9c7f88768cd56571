import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@benchwright/ui';
import type { ClientEstimate } from './get-estimate';
import { estimateQueryOptions } from './get-estimate';

export const acceptEstimate = ({ id, acceptedName }: { id: string; acceptedName: string }) =>
  api<{ estimate: ClientEstimate }>(`/estimates/${encodeURIComponent(id)}/accept`, { body: { acceptedName } });
export function useAcceptEstimate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: acceptEstimate,
    onSuccess: ({ estimate }) => {
      qc.setQueryData(estimateQueryOptions(estimate.id).queryKey, estimate);
      return qc.invalidateQueries({ queryKey: ['projects'] });
    },
  });
}
