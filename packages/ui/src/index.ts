export {
  Button,
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
export { UploadGallery, formatBytes } from './uploads';
