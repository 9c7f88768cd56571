import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@benchwright/ui';
import { projectUploadsQueryOptions } from './get-uploads';

/** `DELETE /api/uploads/:id`: by whoever attached it, or the owner. */
export const deleteUpload = (id: string) => api<void>(`/uploads/${encodeURIComponent(id)}`, { method: 'DELETE' });
export function useDeleteUpload(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteUpload,
    onSuccess: () => qc.invalidateQueries({ queryKey: projectUploadsQueryOptions(projectId).queryKey }),
  });
}
