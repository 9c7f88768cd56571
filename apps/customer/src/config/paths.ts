/** Every URL of the portal, in one place. */
export const paths = {
  home: { path: '/', getHref: () => '/' },
  signUp: { path: '/sign-up', getHref: () => '/sign-up' },
  signIn: {
    path: '/sign-in',
    getHref: (redirect?: string) => (redirect ? `/sign-in?redirect=${encodeURIComponent(redirect)}` : '/sign-in'),
  },
  verifyEmail: { path: '/verify-email', getHref: () => '/verify-email' },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  resetPassword: { path: '/reset-password', getHref: () => '/reset-password' },
  /** the link in the mail when the shop adds a client (the API's clients module) */
  claimAccount: { path: '/claim-account', getHref: () => '/claim-account' },
  design: { path: '/designs/:slug', getHref: (slug: string) => `/designs/${encodeURIComponent(slug)}` },
  account: { path: '/account', getHref: () => '/account' },
  confirmEmail: { path: '/confirm-email', getHref: () => '/confirm-email' },
  projects: { path: '/projects', getHref: () => '/projects' },
  project: { path: '/projects/:id', getHref: (id: string) => `/projects/${encodeURIComponent(id)}` },
  /** a project's file and its thumbnail, served by the API (through the dev proxy) */
  upload: { getHref: (id: string) => `/api/uploads/${encodeURIComponent(id)}` },
  uploadThumbnail: { getHref: (id: string) => `/api/uploads/${encodeURIComponent(id)}/thumbnail` },
  /** served by the API through the dev proxy; a plain link so the browser downloads it */
  estimatePdf: { getHref: (id: string) => `/api/estimates/${encodeURIComponent(id)}/pdf` },
} as const;
