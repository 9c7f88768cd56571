import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UploadSummary } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import { projectUploadsQueryOptions } from './get-uploads';

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
