import { Panel, UploadGallery, useAttachUpload, useDeleteUpload, useProjectUploads } from '@benchwright/ui';
import { paths } from '../../../config/paths';

/**
 * A project's files for the shop. On the request page anyone attaches a file; on the job page (`progress`) the
 * input opens the phone's camera and the photo is filed under the job's current stage.
 */
export function ProjectUploads({
  projectId,
  viewer,
  progress = false,
  stageLabel,
}: {
  projectId: string;
  viewer: { id: string; role: string };
  progress?: boolean;
  stageLabel?: (key: string) => string;
}) {
  const q = useProjectUploads(projectId);
  const attach = useAttachUpload(projectId);
  const remove = useDeleteUpload(projectId);
  return (
    <Panel title={progress ? 'Photos' : 'Files from the client and the shop'}>
      <UploadGallery
        uploads={q.data ?? []}
        fileHref={paths.upload.getHref}
        thumbnailHref={paths.uploadThumbnail.getHref}
        stageLabel={stageLabel}
        canRemove={(u) => viewer.role === 'owner' || u.by.id === viewer.id}
        onRemove={(u) => remove.mutate(u.id)}
        onAttach={(file) => attach.mutate({ file, progress })}
        {...(progress
          ? { attachLabel: 'Add a progress photo to this stage', accept: 'image/*', capture: 'environment' as const }
          : {})}
        pending={attach.isPending || remove.isPending}
        error={attach.error?.message ?? remove.error?.message ?? q.error?.message}
      />
    </Panel>
  );
}
