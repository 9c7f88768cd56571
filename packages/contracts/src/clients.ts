import * as z from 'zod';
import { multiLine, singleLine } from './text';
import { PROJECT_STATUSES } from './lifecycle';
import { ListCursor, ListLimit } from './project-list';

/** `POST /api/clients`: a client who called or walked in; they get a mail to claim the account in the portal. */
export const CreateClientBody = z
  .object({
    name: singleLine().trim().min(1, 'enter the client’s name').max(120, 'use at most 120 characters'),
    email: z
      .string({ error: 'enter the client’s e-mail address' })
      .trim()
      .toLowerCase()
      .pipe(z.email('enter a valid e-mail address').max(254, 'use at most 254 characters')),
    phone: singleLine()
      .max(40, 'use at most 40 characters')
      .regex(/^[0-9+()./ -]*$/, 'use digits, spaces and + ( ) - . / only')
      .default(''),
    address: multiLine().max(300, 'use at most 300 characters').default(''),
  })
  .strict();
export type CreateClientBody = z.input<typeof CreateClientBody>;

export const CLIENT_SORTS = ['name', 'projects', 'accepted', 'paid', 'activity'] as const;
export type ClientSort = (typeof CLIENT_SORTS)[number];

/**
 * `GET /api/clients?q=&sort=&order=&cursor=&limit=`: a page of clients (50 by default, at most 200), keyset-paged
 * like the projects: `nextCursor` (opaque, for its sort and order) names where the next page starts.
 */
export const ClientsQuery = z.object({
  q: singleLine().trim().max(120, 'use at most 120 characters').default(''),
  sort: z.enum(CLIENT_SORTS).default('activity'),
  order: z.enum(['asc', 'desc']).default('desc'),
  cursor: ListCursor.optional(),
  limit: ListLimit,
});
export type ClientsQuery = z.input<typeof ClientsQuery>;

export interface ClientSummary {
  id: string;
  name: string;
  email: string;
  phone: string;
  /** the account has a password: the client has signed up or claimed it */
  claimed: boolean;
  projectCount: number;
  /** the totals of the accepted revisions, one per project at most */
  acceptedCents: number;
  /** paid less refunded */
  paidCents: number;
  /** the latest of the client's projects' events, or when the account was made */
  lastActivityAt: string;
}

export interface ClientDetail extends ClientSummary {
  address: string;
  createdAt: string;
  projects: {
    id: string;
    status: (typeof PROJECT_STATUSES)[number];
    notes: string;
    createdAt: string;
    items: number;
  }[];
}

/** `GET /api/clients` (owner) */
export const ClientsResponse = z.strictObject({
  clients: z.array(
    z.strictObject({
      id: z.string(),
      name: z.string(),
      email: z.string(),
      phone: z.string(),
      claimed: z.boolean(),
      projectCount: z.number().int().min(0),
      acceptedCents: z.number().int(),
      paidCents: z.number().int(),
      lastActivityAt: z.iso.datetime(),
    }),
  ),
  nextCursor: z.string().nullable(),
});
