/** Every URL of the shop app, in one place. */
export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: { path: '/sign-in', getHref: () => '/sign-in' },
  acceptInvitation: { path: '/accept-invitation', getHref: () => '/accept-invitation' },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  resetPassword: { path: '/reset-password', getHref: () => '/reset-password' },
  account: { path: '/account', getHref: () => '/account' },
  confirmEmail: { path: '/confirm-email', getHref: () => '/confirm-email' },
  overview: { path: '/overview', getHref: () => '/overview' },
  board: { path: '/board', getHref: () => '/board' },
  job: { path: '/jobs/:id', getHref: (id: string) => `/jobs/${encodeURIComponent(id)}` },
  /** a project's file and its thumbnail, served by the API (through the dev proxy) */
  upload: { getHref: (id: string) => `/api/uploads/${encodeURIComponent(id)}` },
  uploadThumbnail: { getHref: (id: string) => `/api/uploads/${encodeURIComponent(id)}/thumbnail` },
  travellerPdf: { getHref: (id: string) => `/api/jobs/${encodeURIComponent(id)}/traveller.pdf` },
  /** the part-label sheets (30 labels of 2 5/8 x 1 in to a Letter page) */
  labelsPdf: { getHref: (id: string) => `/api/jobs/${encodeURIComponent(id)}/labels.pdf` },
  requests: { path: '/requests', getHref: () => '/requests' },
  request: { path: '/requests/:id', getHref: (id: string) => `/requests/${encodeURIComponent(id)}` },
  team: { path: '/team', getHref: () => '/team' },
  payments: { path: '/payments', getHref: () => '/payments' },
  mail: { path: '/mail', getHref: () => '/mail' },
  priceBook: { path: '/price-book', getHref: () => '/price-book' },
  settings: { path: '/settings', getHref: () => '/settings' },
  clients: { path: '/clients', getHref: () => '/clients' },
  client: { path: '/clients/:id', getHref: (id: string) => `/clients/${encodeURIComponent(id)}` },
} as const;

export const PORTAL_URL = import.meta.env.VITE_PORTAL_URL ?? 'http://127.0.0.1:5173';
