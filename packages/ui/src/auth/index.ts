/** Signing in and out and resetting a password, the same in both apps. */
export { getMe, meQueryOptions, useMe } from './get-me';
export { signIn, useSignIn } from './sign-in';
export { signOut, useSignOut } from './sign-out';
export { forgotPassword, resetPassword, useForgotPassword, useResetPassword } from './password-reset';
export { SignInForm } from './sign-in-form';
export { safeRedirect } from './safe-redirect';
export { ForgotPasswordForm, ResetPasswordForm } from './password-forms';
