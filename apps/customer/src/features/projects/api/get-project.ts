import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Project } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export const getProject = async (id: string) =>
  (await api<{ project: Project }>(`/projects/${encodeURIComponent(id)}`)).project;
export const projectQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['projects', id], queryFn: () => getProject(id) });
/** While a payment is being recorded, poll until the project moves on. */
export const useProject = (id: string, { waitingForPayment = false } = {}) =>
  useQuery({
    ...projectQueryOptions(id),
    refetchInterval: (q) =>
      waitingForPayment && q.state.data && ['accepted', 'ready'].includes(q.state.data.status) ? 1000 : false,
  });
