import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Project } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

/**
 * A project's files come with the project (`GET /api/projects/:id`): the same query key as the project's own
 * query, so one fetch serves both and an attachment refreshes both.
 */
export const projectUploadsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: ['projects', projectId],
    queryFn: async () => (await api<{ project: Project }>(`/projects/${encodeURIComponent(projectId)}`)).project,
  });
export const useProjectUploads = (projectId: string) =>
  useQuery({ ...projectUploadsQueryOptions(projectId), select: (p) => p.uploads });
