import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Project } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export const getProject = async (id: string) =>
  (await api<{ project: Project }>(`/projects/${encodeURIComponent(id)}`)).project;
export const projectQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['projects', id], queryFn: () => getProject(id) });
export const useProject = (id: string) => useQuery(projectQueryOptions(id));
