import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@benchwright/ui';
import type { Layouts } from '../../../components/shop-paper';

/** The request's cut list, sheet layouts and pick list, laid out by the server at 'thorough' (owner only). */
export const layoutsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: ['projects', projectId, 'layouts'],
    queryFn: async () =>
      (await api<{ layouts: Layouts }>(`/projects/${encodeURIComponent(projectId)}/layouts`)).layouts,
    staleTime: 60_000,
  });
export const useLayouts = (projectId: string, enabled: boolean) =>
  useQuery({ ...layoutsQueryOptions(projectId), enabled });
