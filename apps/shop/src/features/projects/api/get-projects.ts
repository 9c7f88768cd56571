import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Project } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export const getProjects = async () => (await api<{ projects: Project[] }>('/projects')).projects;
export const projectsQueryOptions = () => queryOptions({ queryKey: ['projects'], queryFn: getProjects });
export const useProjects = () => useQuery(projectsQueryOptions());
