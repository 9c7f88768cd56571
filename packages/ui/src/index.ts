export {
  Button,
  MoreButton,
  CommentForm,
  Drawing,
  Field,
  formatMoney,
  Length,
  Money,
  Notice,
  Panel,
  TableHead,
} from './components';
export { api, ApiRequestError } from './api-client';
export { applyServerIssues } from './form-errors';
export { useComment } from './comments';
export {
  attachUpload,
  deleteUpload,
  projectUploadsQueryOptions,
  useAttachUpload,
  useDeleteUpload,
  useProjectUploads,
} from './uploads-api';
export { UploadGallery, formatBytes } from './uploads';
export { ShopLogo } from './shop-logo';
export { getProjectsPage, projectsQueryOptions, projectsSearch, useProjects } from './projects-api';
export type { ProjectListFilters } from './projects-api';
export { ChoicesList } from './choices';
export type { PieceChoices } from './choices';
