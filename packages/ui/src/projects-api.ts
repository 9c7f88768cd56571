import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import type { ProjectSort, ProjectStatus, ProjectsResponse, SortDirection } from '@benchwright/contracts';
import { api } from './api-client';

/** What the list asks the API for (`GET /api/projects`); each page follows the last one's cursor. */
export interface ProjectListFilters {
  status?: readonly ProjectStatus[];
  q?: string;
  sort: ProjectSort;
  dir: SortDirection;
  limit?: number;
}

export function projectsSearch(f: ProjectListFilters, cursor: string | null): string {
  const p = new URLSearchParams({ sort: f.sort, dir: f.dir });
  if (f.status?.length) p.set('status', f.status.join(','));
  if (f.q?.trim()) p.set('q', f.q.trim());
  if (f.limit) p.set('limit', String(f.limit));
  if (cursor) p.set('cursor', cursor);
  return p.toString();
}

export const getProjectsPage = (f: ProjectListFilters, cursor: string | null) =>
  api<ProjectsResponse>(`/projects?${projectsSearch(f, cursor)}`);

/** Under ['projects'], so whatever invalidates the projects refreshes every page of every list. */
export const projectsQueryOptions = (f: ProjectListFilters) =>
  infiniteQueryOptions({
    queryKey: ['projects', 'list', f],
    queryFn: ({ pageParam }) => getProjectsPage(f, pageParam),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor ?? null,
  });
export const useProjects = (f: ProjectListFilters) => useInfiniteQuery(projectsQueryOptions(f));
