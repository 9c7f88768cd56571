import { createBrowserRouter, createMemoryRouter, type RouteObject } from 'react-router-dom';
import { PublicLayout, ShopLayout } from '../components/layout';
import { paths } from '../config/paths';
import { AccountRoute, ConfirmEmailRoute } from './routes/account';
import { AcceptInvitationRoute } from './routes/accept-invitation';
import { BoardRoute } from './routes/board';
import { JobRoute } from './routes/job';
import { ForgotPasswordRoute, ResetPasswordRoute } from './routes/password';
import { MailRoute } from './routes/mail';
import { OverviewRoute } from './routes/overview';
import { PaymentsRoute } from './routes/payments';
import { PriceBookRoute } from './routes/price-book';
import { RequestRoute } from './routes/request';
import { RequestsRoute } from './routes/requests';
import { SignInRoute } from './routes/sign-in';
import { TeamRoute } from './routes/team';
import { SettingsRoute } from './routes/settings';
import { ClientRoute, ClientsRoute } from './routes/clients';

export const routes: RouteObject[] = [
  {
    element: <PublicLayout />,
    children: [
      { path: paths.signIn.path, element: <SignInRoute /> },
      { path: paths.acceptInvitation.path, element: <AcceptInvitationRoute /> },
      { path: paths.forgotPassword.path, element: <ForgotPasswordRoute /> },
      { path: paths.resetPassword.path, element: <ResetPasswordRoute /> },
      { path: paths.confirmEmail.path, element: <ConfirmEmailRoute /> },
    ],
  },
  {
    path: paths.home.path,
    element: <ShopLayout />,
    children: [
      { path: paths.overview.path, element: <OverviewRoute /> },
      { path: paths.board.path, element: <BoardRoute /> },
      { path: paths.job.path, element: <JobRoute /> },
      { path: paths.requests.path, element: <RequestsRoute /> },
      { path: paths.request.path, element: <RequestRoute /> },
      { path: paths.team.path, element: <TeamRoute /> },
      { path: paths.payments.path, element: <PaymentsRoute /> },
      { path: paths.mail.path, element: <MailRoute /> },
      { path: paths.priceBook.path, element: <PriceBookRoute /> },
      { path: paths.settings.path, element: <SettingsRoute /> },
      { path: paths.clients.path, element: <ClientsRoute /> },
      { path: paths.client.path, element: <ClientRoute /> },
      { path: paths.account.path, element: <AccountRoute /> },
    ],
  },
];

export const createRouter = () => createBrowserRouter(routes);
export const createTestRouter = (url: string) => createMemoryRouter(routes, { initialEntries: [url] });
