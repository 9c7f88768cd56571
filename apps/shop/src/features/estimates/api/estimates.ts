import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { EstimateView, UpdateEstimateBody, WithdrawEstimateBody } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

/** The owner's view of an estimate: the contract's type with the owner-only fields present. */
export type OwnerEstimate = EstimateView &
  Required<Pick<EstimateView, 'hoursByStage' | 'layouts' | 'costCents'>> & {
    lines: (EstimateView['lines'][number] & { costCents: number; overrideReason: string | null })[];
  };

const path = (id: string) => `/estimates/${encodeURIComponent(id)}`;
export const getEstimate = async (id: string) => (await api<{ estimate: OwnerEstimate }>(path(id))).estimate;
export const estimateQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['estimates', id], queryFn: () => getEstimate(id) });
export const useEstimate = (id: string | undefined) =>
  useQuery({ ...estimateQueryOptions(id ?? ''), enabled: Boolean(id) });

function useEstimateMutation<A>(fn: (a: A) => Promise<{ estimate: OwnerEstimate }>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: ({ estimate }) => {
      qc.setQueryData(estimateQueryOptions(estimate.id).queryKey, estimate);
      return qc.invalidateQueries({ queryKey: ['projects'] });
    },
  });
}

/** The next revision: priced by the engine, or a copy of the latest to edit. */
export const useCreateEstimate = () =>
  useEstimateMutation(({ projectId, source }: { projectId: string; source: 'engine' | 'copy' }) =>
    api<{ estimate: OwnerEstimate }>(`/projects/${encodeURIComponent(projectId)}/estimates`, { body: { source } }),
  );
export const useUpdateEstimate = () =>
  useEstimateMutation(({ id, body }: { id: string; body: UpdateEstimateBody }) =>
    api<{ estimate: OwnerEstimate }>(path(id), { method: 'PATCH', body }),
  );
export const useSendEstimate = () =>
  useEstimateMutation((id: string) => api<{ estimate: OwnerEstimate }>(`${path(id)}/send`, { method: 'POST' }));
/** Takes back an accepted revision (before any deposit), saying why; the client is told. */
export const useWithdrawEstimate = () =>
  useEstimateMutation(({ id, body }: { id: string; body: WithdrawEstimateBody }) =>
    api<{ estimate: OwnerEstimate }>(`${path(id)}/withdraw`, { body }),
  );
