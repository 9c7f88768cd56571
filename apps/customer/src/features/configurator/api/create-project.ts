import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateProjectBody, Project } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export const createProject = async (body: CreateProjectBody) =>
  (await api<{ project: Project }>('/projects', { body })).project;
/** Sends the configured piece as a request; the "My projects" list (query key ['projects']) refreshes. */
export function useCreateProject() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createProject, onSuccess: () => qc.invalidateQueries({ queryKey: ['projects'] }) });
}
