/** The account page and its API, the same in both apps. */
export {
  accountQueryOptions,
  confirmEmailChange,
  sessionsQueryOptions,
  useAccount,
  useConfirmEmailChange,
  useSessions,
} from './account-api';
export { AccountPage, ConfirmEmailChange, describeBrowser } from './account-page';
