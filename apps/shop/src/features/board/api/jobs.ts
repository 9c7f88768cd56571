import { queryOptions, useIsMutating, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ProjectStatus, StageKey } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import type { ChecklistItem, LengthUnit, Traveller } from '@benchwright/pricing/geometry';

export type { StageKey };
type Hours = Partial<Record<StageKey, number>> & { total: number };
export interface Job {
  id: string;
  project: { id: string; status: ProjectStatus; notes: string };
  clientName: string;
  stage: StageKey;
  position: number;
  builder: { id: string; name: string } | null;
  dueDate: string | null;
  hoursBudgeted: Hours;
  hoursLogged: Hours;
}
export interface Stage {
  key: StageKey;
  label: string;
  position: number;
}

export const jobsQueryOptions = () =>
  queryOptions({
    queryKey: ['jobs'],
    queryFn: async () => (await api<{ jobs: Job[] }>('/jobs')).jobs,
    refetchInterval: 15_000,
  });
const moveKey = ['jobs', 'move'];
/** The jobs; the periodic refresh pauses while a move is on its way, so a list read before it cannot undo it on screen. */
export function useJobs() {
  const moving = useIsMutating({ mutationKey: moveKey }) > 0;
  return useQuery({ ...jobsQueryOptions(), refetchInterval: moving ? false : 15_000 });
}
export const stagesQueryOptions = () =>
  queryOptions({
    queryKey: ['stages'],
    queryFn: async () => (await api<{ stages: Stage[] }>('/jobs/stages')).stages,
    staleTime: 5 * 60_000,
  });
export const useStages = () => useQuery(stagesQueryOptions());

/** Moves a job; the board shows the move at once and takes it back if the server refuses. */
export function useMoveJob() {
  const qc = useQueryClient();
  const key = jobsQueryOptions().queryKey;
  return useMutation({
    mutationKey: moveKey,
    mutationFn: ({ id, stageKey }: { id: string; stageKey: StageKey }) =>
      api<{ job: Job }>(`/jobs/${encodeURIComponent(id)}`, { method: 'PATCH', body: { stageKey } }),
    onMutate: async ({ id, stageKey }) => {
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData(key);
      qc.setQueryData(key, (jobs: Job[] | undefined) =>
        jobs?.map((j) => (j.id === id ? { ...j, stage: stageKey } : j)),
      );
      return { before };
    },
    onError: (_e, _v, ctx) => qc.setQueryData(key, ctx?.before),
    onSettled: () => qc.invalidateQueries({ queryKey: key }),
  });
}

export function useLogTime() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, stageKey, hours, note }: { id: string; stageKey: StageKey; hours: number; note: string }) =>
      api<{ job: Job }>(`/jobs/${encodeURIComponent(id)}/time`, { body: { stageKey, hours, note } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: jobsQueryOptions().queryKey }),
  });
}

/**
 * The job's traveller: cut list, sheet layouts, pick list, hours and cautions, as kept with the accepted
 * revision (or laid out again by the owner, which `layout` says); no prices.
 */
export type ChecklistStep = ChecklistItem & { done: { by: string; at: string } | null };
export type JobTraveller = Traveller & {
  job: Job;
  /** the stage checklist, with who ticked each step and when */
  checklist: ChecklistStep[];
  units: LengthUnit;
  layout?: { source: 'revision' | 'relayout'; revision: number; at: string; note: string };
};
export const travellerQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['jobs', id, 'traveller'],
    queryFn: async () =>
      (await api<{ traveller: JobTraveller }>(`/jobs/${encodeURIComponent(id)}/traveller`)).traveller,
    staleTime: 60_000,
  });
export const useTraveller = (id: string) => useQuery(travellerQueryOptions(id));

/** The owner assigns a builder and a due date (either may be cleared with null). */
export function useUpdateJob() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: { id: string; builderId?: string | null; dueDate?: string | null }) =>
      api<{ job: Job }>(`/jobs/${encodeURIComponent(id)}`, { method: 'PATCH', body }),
    onSuccess: (_r, v) => {
      void qc.invalidateQueries({ queryKey: jobsQueryOptions().queryKey });
      void qc.invalidateQueries({ queryKey: travellerQueryOptions(v.id).queryKey });
    },
  });
}

/** The owner lays the job's sheets out again with today's stock; the accepted revision's layout is kept. */
export function useRelayout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      api<{ traveller: JobTraveller }>(`/jobs/${encodeURIComponent(id)}/relayout`, { method: 'POST' }),
    onSuccess: (r, id) => qc.setQueryData(travellerQueryOptions(id).queryKey, r.traveller),
  });
}

/** The builder ticks (or unticks) a step of the job's stage checklist; who and when are kept. */
export function useCheckStep() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, key, done }: { id: string; key: string; done: boolean }) =>
      api<{ checklist: ChecklistStep[] }>(`/jobs/${encodeURIComponent(id)}/checks/${encodeURIComponent(key)}`, {
        method: 'PUT',
        body: { done },
      }),
    onSuccess: (r, v) =>
      qc.setQueryData(travellerQueryOptions(v.id).queryKey, (t: JobTraveller | undefined) =>
        t ? { ...t, checklist: r.checklist } : t,
      ),
  });
}
