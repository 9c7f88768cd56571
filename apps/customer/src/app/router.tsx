import { createBrowserRouter, createMemoryRouter, type RouteObject } from 'react-router-dom';
import { Layout } from '../components/layout';
import { paths } from '../config/paths';
import { AccountRoute, ConfirmEmailRoute } from './routes/account';
import { DesignRoute } from './routes/design';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { HomeRoute } from './routes/home';
import { ProjectRoute } from './routes/project';
import { ProjectsRoute } from './routes/projects';
import { ResetPasswordRoute } from './routes/reset-password';
import { ClaimAccountRoute } from './routes/claim-account';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { VerifyEmailRoute } from './routes/verify-email';

export const routes: RouteObject[] = [
  {
    element: <Layout />,
    children: [
      { path: paths.home.path, element: <HomeRoute /> },
      { path: paths.design.path, element: <DesignRoute /> },
      { path: paths.signUp.path, element: <SignUpRoute /> },
      { path: paths.signIn.path, element: <SignInRoute /> },
      { path: paths.verifyEmail.path, element: <VerifyEmailRoute /> },
      { path: paths.forgotPassword.path, element: <ForgotPasswordRoute /> },
      { path: paths.resetPassword.path, element: <ResetPasswordRoute /> },
      { path: paths.claimAccount.path, element: <ClaimAccountRoute /> },
      { path: paths.projects.path, element: <ProjectsRoute /> },
      { path: paths.project.path, element: <ProjectRoute /> },
      { path: paths.account.path, element: <AccountRoute /> },
      { path: paths.confirmEmail.path, element: <ConfirmEmailRoute /> },
    ],
  },
];

export const createRouter = () => createBrowserRouter(routes);
export const createTestRouter = (url: string) => createMemoryRouter(routes, { initialEntries: [url] });
