import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Project, UploadSummary } from '@benchwright/contracts';
import { api } from './api-client';

// A project's files, the same in both apps: read with the project, attached and removed through the API.
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

/** `POST /api/projects/:id/uploads`: one file, multipart; `progress` records the job's current stage. */
export const attachUpload = async ({
  projectId,
  file,
  progress = false,
}: {
  projectId: string;
  file: File;
  progress?: boolean;
}) => {
  const body = new FormData();
  if (progress) body.append('purpose', 'progress');
  body.append('file', file);
  return (await api<{ upload: UploadSummary }>(`/projects/${encodeURIComponent(projectId)}/uploads`, { body })).upload;
};
export function useAttachUpload(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { file: File; progress?: boolean }) => attachUpload({ projectId, ...v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: projectUploadsQueryOptions(projectId).queryKey }),
  });
}

/** `DELETE /api/uploads/:id`: by whoever attached it, or the owner. */
export const deleteUpload = (id: string) => api<void>(`/uploads/${encodeURIComponent(id)}`, { method: 'DELETE' });
export function useDeleteUpload(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteUpload,
    onSuccess: () => qc.invalidateQueries({ queryKey: projectUploadsQueryOptions(projectId).queryKey }),
  });
}
