import { ROLES, type Role } from '@shuntwise/contracts';

/**
 * Who may call each route: the role × route table the README's roles table summarises.
 * Least privilege: admins administer users, invitations and the mail (outbox, who is
 * mailed about a house part) and read everything else; engineers own the engineering data
 * (catalogue, datasheets, specs, sources, imports, cases); designers find and check parts
 * and ask for qualifications; buyers read and export the source list and choose what they
 * are mailed about. `public` routes need no token. `api/test/route-roles.e2e-spec.ts`
 * checks this table against the routes the app registers (both ways) and calls every route
 * with every role and with no token.
 */
export type Access = 'public' | readonly Role[];

const ALL = ROLES;
const ENGINEER = ['engineer'] as const;
const READERS = ['engineer', 'admin', 'designer'] as const;

export const ROUTE_ROLES: Readonly<Record<string, Access>> = {
  // sign-in
  'POST /api/auth/login': 'public',
  'GET /api/auth/me': ALL,
  'POST /api/auth/logout': ALL,
  'GET /api/auth/invitations/:token': 'public',
  'POST /api/auth/invitations/accept': 'public',
  'GET /api/health': 'public',
  'GET /api/health/ready': 'public',
  'GET /api/health/live': 'public',

  // administration
  'GET /api/users': ['admin'],
  'GET /api/users/invitations': ['admin'],
  'POST /api/users/invitations': ['admin'],
  'POST /api/users/invitations/:id/resend': ['admin'],
  'POST /api/users/invitations/:id/revoke': ['admin'],
  'PATCH /api/users/:id': ['admin'],
  'GET /api/outbox': ['admin'],

  // catalogue: everyone reads, engineers write
  'GET /api/house-parts': ALL,
  'POST /api/house-parts': ENGINEER,
  'GET /api/house-parts/:id': ALL,
  'PATCH /api/house-parts/:id': ENGINEER,
  'GET /api/house-parts/:id/spec': ALL,
  'PUT /api/house-parts/:id/spec': ENGINEER,
  'GET /api/house-parts/:id/spec/versions': ALL,
  'GET /api/house-parts/:id/sources': ALL,
  'POST /api/house-parts/:id/sources': ENGINEER,
  'PATCH /api/house-parts/:id/sources/:vendorPartId': ENGINEER,
  'DELETE /api/house-parts/:id/sources/:vendorPartId': ENGINEER,
  'GET /api/house-parts/:id/buyers': ['engineer', 'admin', 'buyer'],
  'POST /api/house-parts/:id/buyers': ['engineer', 'admin', 'buyer'],
  'DELETE /api/house-parts/:id/buyers/:userId': ['engineer', 'admin', 'buyer'],
  'GET /api/vendor-parts': ALL,
  'POST /api/vendor-parts': ENGINEER,
  'GET /api/vendor-parts/:id': ALL,
  'PATCH /api/vendor-parts/:id': ENGINEER,
  'GET /api/manufacturers': ALL,
  'GET /api/vendor-parts/:id/rating-card': READERS,
  'PUT /api/vendor-parts/:id/rating-card': ENGINEER,
  'GET /api/vendor-parts/:id/rating-card/versions': READERS,
  'GET /api/vendor-parts/:id/model': READERS,
  'POST /api/measurement-sets/preview': ENGINEER,
  'POST /api/measurement-sets': ENGINEER,
  'GET /api/measurement-sets/:id': ['engineer', 'admin'],
  'GET /api/measurement-sets/:id/file': ['engineer', 'admin'],
  'GET /api/vendor-parts/:id/measurement-sets': ['engineer', 'admin'],
  'POST /api/datasheets': ENGINEER,
  'GET /api/datasheets/:id': ALL,
  'GET /api/datasheets/:id/file': ALL,
  'GET /api/datasheets/:id/extraction': READERS,
  'POST /api/datasheets/:id/extraction': ENGINEER,
  'POST /api/datasheets/:id/variants': ENGINEER,
  'POST /api/imports/vendor-series/preview': ENGINEER,
  'POST /api/imports/vendor-series': ENGINEER,
  'GET /api/exports/rating-cards': READERS,
  'GET /api/exports/house-parts': ALL,

  // computations (no stored data)
  'POST /api/engineering/normalize': ALL,
  'POST /api/engineering/regulator': ALL,

  // designers' search
  'GET /api/search': READERS,
  'GET /api/search/facets': READERS,

  // qualification: engineers prepare and decide, others read what their role needs
  'GET /api/qualifications': READERS,
  'POST /api/qualifications': ENGINEER,
  'GET /api/qualifications/:id': READERS,
  'PATCH /api/qualifications/:id': ENGINEER,
  'POST /api/qualifications/:id/comments': ENGINEER,
  'POST /api/qualifications/:id/evaluate': ENGINEER,
  'POST /api/qualifications/:id/submit': ENGINEER,
  'POST /api/qualifications/:id/send-back': ENGINEER,
  'POST /api/qualifications/:id/approve': ENGINEER,
  'POST /api/qualifications/:id/clear': ENGINEER,
  'POST /api/qualifications/:id/clear-with-conditions': ENGINEER,
  'POST /api/qualifications/:id/reject': ENGINEER,
  'POST /api/qualifications/:id/withdraw': ENGINEER,
  'POST /api/qualifications/:id/revoke': ENGINEER,
  'POST /api/qualifications/:id/recheck': ENGINEER,
  'POST /api/qualifications/:id/clear-with-waiver': ENGINEER,
  'GET /api/qualifications/:id/waivers': ['engineer', 'admin'],
  'POST /api/qualifications/:id/waivers': ENGINEER,
  'POST /api/qualifications/:id/waivers/:waiverId/approve': ENGINEER,
  'POST /api/qualifications/:id/waivers/:waiverId/refuse': ENGINEER,
  // the PDF record of a decided case (designers: usable cases only, as the case route decides)
  'GET /api/qualifications/:id/record': ALL,
  'GET /api/qualifications/:id/record/meta': ALL,
  'GET /api/qualification-views/board': ['engineer', 'admin'],
  'GET /api/qualification-views/compare/:housePartId': READERS,
  'GET /api/qualification-views/sources': ALL,
  'GET /api/qualification-views/sources.csv': ALL,
  'GET /api/qualification-requests': READERS,
  'POST /api/qualification-requests': ['designer', 'engineer'],
  'GET /api/qualification-requests/:id': READERS,
  'POST /api/qualification-requests/:id/open-case': ENGINEER,
  'POST /api/qualification-requests/:id/decline': ENGINEER,
};
