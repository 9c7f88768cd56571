import { Panel, UploadGallery, useAttachUpload, useDeleteUpload, useProjectUploads } from '@benchwright/ui';
import { paths } from '../../../config/paths';

/** The board's stages as the client reads them (the shop's default names). */
const STAGE_WORDS: Record<string, string> = {
  material: 'Material',
  cutting: 'Cutting',
  casework: 'Casework',
  drawers_doors: 'Drawers & doors',
  finish: 'Finish',
  ready: 'Ready',
  delivered: 'Delivered',
};

/** The project's photos, sketches and PDFs, and the shop's progress photos; the client attaches and removes their own. */
export function ProjectUploads({ projectId, viewer }: { projectId: string; viewer: { id: string; role: string } }) {
  const q = useProjectUploads(projectId);
  const attach = useAttachUpload(projectId);
  const remove = useDeleteUpload(projectId);
  const uploads = q.data ?? [];
  const progress = uploads.filter((u) => u.stageKey);
  const files = uploads.filter((u) => !u.stageKey);
  const common = {
    fileHref: paths.upload.getHref,
    thumbnailHref: paths.uploadThumbnail.getHref,
    stageLabel: (k: string) => STAGE_WORDS[k] ?? k,
  };
  return (
    <>
      {progress.length ? (
        <Panel title="Progress photos">
          <UploadGallery uploads={progress} {...common} />
        </Panel>
      ) : null}
      <Panel title="Photos and drawings">
        <UploadGallery
          uploads={files}
          {...common}
          empty="Add photos of the space, a sketch or a drawing so the shop sees what you have in mind."
          canRemove={(u) => u.by.id === viewer.id}
          onRemove={(u) => remove.mutate(u.id)}
          onAttach={viewer.role === 'client' ? (file) => attach.mutate({ file }) : undefined}
          pending={attach.isPending || remove.isPending}
          error={attach.error?.message ?? remove.error?.message}
        />
      </Panel>
    </>
  );
}
