import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { StageFeedback, StageKey } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

/** `GET /api/hours-feedback`: per stage, delivered jobs' logged hours against their budgets. */
export type StageHours = StageFeedback;
export interface HoursFeedback {
  stages: StageHours[];
  /** the price book's version the suggestions were read against; sent back to apply one */
  priceBookVersion: number;
  /** the shop's units, which the standards are shown in */
  units: 'in' | 'mm';
}

const hoursQueryOptions = () =>
  queryOptions({
    queryKey: ['hours-feedback'],
    queryFn: () => api<HoursFeedback>('/hours-feedback'),
  });
export const useHoursFeedback = () => useQuery(hoursQueryOptions());

/** The owner sets a stage's suggestion aside until more jobs are delivered. */
export function useDismissHours() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (stage: StageKey) => api<HoursFeedback>(`/hours-feedback/${stage}/dismiss`, { method: 'POST' }),
    onSuccess: (r) => qc.setQueryData(hoursQueryOptions().queryKey, r),
  });
}

/**
 * The owner applies a stage's suggestion: a new price-book version with the stage's time standards scaled. A 409
 * (the book changed, or the suggestion no longer stands) reloads the feedback so the owner sees it as it is now.
 */
export function useApplyHours() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ stage, version }: { stage: StageKey; version: number }) =>
      api<HoursFeedback>(`/hours-feedback/${stage}/apply`, { body: { version } }),
    onSuccess: (r) => {
      qc.setQueryData(hoursQueryOptions().queryKey, {
        stages: r.stages,
        priceBookVersion: r.priceBookVersion,
        units: r.units,
      });
      void qc.invalidateQueries({ queryKey: ['price-book'] });
    },
    onError: () => void qc.invalidateQueries({ queryKey: hoursQueryOptions().queryKey }),
  });
}
