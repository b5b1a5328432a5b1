/**
 * Who may call each route of the API: one entry per "METHOD /path" the app has. The yardstick is OWASP
 * ASVS 4.0.3 level 2, chapter V4 (Access Control: V4.1.3 least privilege, V4.2.1 protection against
 * insecure direct object references) and DEVELOPERS.md's rules: signed out 401; not a member of the
 * club 403 on /api/clubs/:clubId/… and 404 on a record by id; a member without the role 403.
 * tests/api/authorization-matrix.test.ts fails for a route the app has and this table lacks, and for
 * an entry with no route.
 */

/** The people the matrix sends each request as (club A is the club of every id in the path). */
export const ROLES = ['anonymous', 'volunteer', 'holder', 'otherCoordinator', 'coordinator'] as const;
export type MatrixRole = (typeof ROLES)[number];

export type AccessRule =
  /** Anyone, signed in or not, gets the same kind of answer (sign-in, the application form, a reset request). */
  | 'public'
  /** No sign-in: the token in the body, query or address is the key. The matrix sends one that is not ours (the feed: a real one). */
  | 'link-token'
  /** Any signed-in person; what they get is their own (their fees, signing out of their session). */
  | 'signed-in'
  /** A member of the club named by :clubId (or by the body's clubId), any role. */
  | 'club-member'
  /** A coordinator of the club named by :clubId. */
  | 'club-coordinator'
  /** Any member of the record's club (a site, plot, season, shift); outside the club the record is 404. */
  | 'record-member'
  /** A coordinator of the record's club; another member 403, outside 404. */
  | 'record-coordinator'
  /** The plot's holder this season or a coordinator (the plot book's rule, plot books not shared; the weather log's writers). */
  | 'holder-or-coordinator'
  /** Volunteers and coordinators of the shift's club (taking a place); a plot holder 403. */
  | 'volunteer-or-coordinator'
  /** Only the person the record is for (a renewal by id); anyone else 404, as for a record that is not there. */
  | 'owner'
  /** The person the record is for, or a coordinator (a volunteer's done photo); another member 404. */
  | 'owner-or-coordinator';

export interface TableEntry {
  rule: AccessRule;
  /** What the route does with the made-up link token, for every role alike ('link-token' only). */
  tokenAnswer?: number;
}

const pub: TableEntry = { rule: 'public' };
const signedIn: TableEntry = { rule: 'signed-in' };
const member: TableEntry = { rule: 'club-member' };
const coordinator: TableEntry = { rule: 'club-coordinator' };
const recordMember: TableEntry = { rule: 'record-member' };
const recordCoordinator: TableEntry = { rule: 'record-coordinator' };
const holderOrCoordinator: TableEntry = { rule: 'holder-or-coordinator' };
const link = (tokenAnswer: number): TableEntry => ({ rule: 'link-token', tokenAnswer });

export const AUTHORIZATION_TABLE: Record<string, TableEntry> = {
  // Session and accounts
  'GET /api/session': pub,
  'POST /api/session': pub,
  'PUT /api/session/club': member, // the club is the body's clubId
  'DELETE /api/session': pub,
  'POST /api/password-resets': pub,
  'GET /api/password-resets/check': link(404),
  'POST /api/password-resets/complete': link(410), // a link not ours reads as used or expired
  'GET /api/invites/preview': link(404),
  'POST /api/invites/accept': link(404),
  'POST /api/club-signups': pub,
  'GET /api/club-signups/check': link(404),
  'POST /api/club-signups/confirm': link(404),
  // Invites and members (they name people: coordinators)
  'GET /api/clubs/:clubId/invites': coordinator,
  'POST /api/clubs/:clubId/invites': coordinator,
  'POST /api/clubs/:clubId/invites/:inviteId/resend': coordinator,
  'DELETE /api/clubs/:clubId/invites/:inviteId': coordinator,
  'GET /api/clubs/:clubId/members': coordinator,
  'PATCH /api/clubs/:clubId/members/:userId': coordinator,
  'DELETE /api/clubs/:clubId/members/:userId': coordinator,
  'DELETE /api/clubs/:clubId/members/:userId/roles/:role': coordinator,
  // Sites and plots
  'GET /api/clubs/:clubId/sites': member,
  'POST /api/clubs/:clubId/sites': coordinator,
  'GET /api/sites/:siteId': recordMember,
  'PATCH /api/sites/:siteId': recordCoordinator,
  'DELETE /api/sites/:siteId': recordCoordinator,
  'POST /api/sites/:siteId/archive': recordCoordinator,
  'GET /api/sites/:siteId/plots': recordMember,
  'POST /api/sites/:siteId/plots': recordCoordinator,
  'GET /api/sites/:siteId/plots.csv': recordMember,
  'GET /api/sites/:siteId/neighbours': recordMember,
  'POST /api/sites/:siteId/plot-imports': recordCoordinator,
  'GET /api/sites/:siteId/plot-imports/template.csv': recordCoordinator,
  'POST /api/sites/:siteId/background': recordCoordinator,
  'GET /api/sites/:siteId/background': recordMember,
  'DELETE /api/sites/:siteId/background': recordCoordinator,
  'GET /api/plots/:plotId': recordMember,
  'PATCH /api/plots/:plotId': recordCoordinator,
  'DELETE /api/plots/:plotId': recordCoordinator,
  // The waiting list
  'GET /api/apply/:clubSlug': pub,
  'POST /api/apply/:clubSlug': pub,
  'GET /api/clubs/:clubId/waitlist': coordinator,
  'POST /api/applications/:applicationId/move': recordCoordinator,
  'POST /api/applications/:applicationId/remove': recordCoordinator,
  'GET /api/applications/:applicationId/history': recordCoordinator,
  'POST /api/clubs/:clubId/member-imports': coordinator,
  'GET /api/clubs/:clubId/member-imports/template.csv': coordinator,
  'POST /api/clubs/:clubId/waitlist-imports': coordinator,
  'GET /api/clubs/:clubId/waitlist-imports/template.csv': coordinator,
  'GET /api/clubs/:clubId/exports/members.csv': coordinator,
  'GET /api/clubs/:clubId/exports/waitlist.csv': coordinator,
  'GET /api/clubs/:clubId/exports/allocations.csv': coordinator,
  // Mail
  'GET /api/clubs/:clubId/mailings': coordinator,
  'GET /api/clubs/:clubId/mailings/audience': coordinator,
  'POST /api/clubs/:clubId/mailings': coordinator,
  'GET /api/clubs/:clubId/mail-preferences': member,
  'PUT /api/clubs/:clubId/mail-preferences': member,
  'GET /api/clubs/:clubId/outbox': coordinator,
  'POST /api/clubs/:clubId/outbox/:messageId/resend': coordinator,
  'GET /api/clubs/:clubId/my-plot': member,
  // Crop notes
  'GET /api/clubs/:clubId/crops': member,
  'POST /api/clubs/:clubId/crops': coordinator,
  'POST /api/clubs/:clubId/crops/relations': coordinator,
  'DELETE /api/clubs/:clubId/crops/relations/:relationId': coordinator,
  'GET /api/clubs/:clubId/crops/:cropId': member,
  'PUT /api/clubs/:clubId/crops/:cropId/overrides/:field': coordinator,
  'DELETE /api/clubs/:clubId/crops/:cropId/overrides/:field': coordinator,
  'GET /api/clubs/:clubId/harvest-figures': member,
  'GET /api/clubs/:clubId/season-summary': coordinator,
  'GET /api/clubs/:clubId/mail-templates': coordinator,
  'GET /api/clubs/:clubId/mail-templates/:name/preview': coordinator,
  'GET /api/clubs/:clubId/mail-templates/:name/preview.html': coordinator,
  // Seasons, offers, renewals
  'GET /api/clubs/:clubId/seasons': member,
  'GET /api/clubs/:clubId/seasons/opening-preview': coordinator,
  'POST /api/clubs/:clubId/seasons': coordinator,
  'GET /api/seasons/:seasonId': recordMember,
  'GET /api/seasons/:seasonId/plot-states': recordMember,
  'GET /api/seasons/:seasonId/left-out': recordCoordinator,
  'POST /api/seasons/:seasonId/late-renewals': recordCoordinator,
  'GET /api/seasons/:seasonId/offer-quote': recordCoordinator,
  'POST /api/seasons/:seasonId/offers': recordCoordinator,
  'GET /api/offers/preview': link(404),
  'POST /api/offers/accept': link(404),
  'POST /api/offers/decline': link(404),
  'POST /api/offers/:offerId/withdraw': recordCoordinator,
  'GET /api/renewals/preview': link(404),
  'POST /api/renewals/keep': link(404),
  'POST /api/renewals/release': link(404),
  'GET /api/renewals/:renewalId': { rule: 'owner' },
  'POST /api/renewals/:renewalId/keep': { rule: 'owner' },
  'POST /api/renewals/:renewalId/release': { rule: 'owner' },
  // Club settings and fees
  'GET /api/clubs/:clubId': member,
  'PATCH /api/clubs/:clubId': coordinator,
  'GET /api/clubs/:clubId/checklist': coordinator,
  'PATCH /api/clubs/:clubId/checklist': coordinator,
  'GET /api/clubs/:clubId/fee-schedule': coordinator,
  'PUT /api/clubs/:clubId/fee-schedule': coordinator,
  'GET /api/clubs/:clubId/fees': coordinator,
  'GET /api/clubs/:clubId/fees.csv': coordinator,
  'POST /api/fees/:feeId/payments': recordCoordinator,
  'GET /api/me/fees': signedIn,
  // The neighbour check
  'POST /api/plots/:plotId/plantings/check': holderOrCoordinator,
  'GET /api/plots/:plotId/what-fits': holderOrCoordinator,
  'GET /api/sites/:siteId/findings': recordCoordinator,
  'GET /api/clubs/:clubId/findings': coordinator,
  'GET /api/clubs/:clubId/findings/export.csv': coordinator,
  // Tasks
  'GET /api/plots/:plotId/tasks': holderOrCoordinator,
  'POST /api/tasks/:taskId/done': holderOrCoordinator, // a task of the holder's plot, not handed to volunteers
  'POST /api/tasks/:taskId/reopen': holderOrCoordinator,
  'POST /api/tasks/:taskId/skip': holderOrCoordinator,
  'POST /api/plots/:plotId/handovers': holderOrCoordinator,
  'DELETE /api/handovers/:handoverId': holderOrCoordinator,
  'GET /api/sites/:siteId/tasks': recordCoordinator,
  'GET /api/sites/:siteId/tasks.csv': recordCoordinator,
  'POST /api/sites/:siteId/tasks': recordCoordinator,
  'DELETE /api/tasks/:taskId': recordCoordinator,
  'POST /api/sites/:siteId/task-runs': recordCoordinator,
  'GET /api/task-runs/:runId': recordCoordinator,
  'GET /api/sites/:siteId/water': recordMember,
  // The plot book
  'GET /api/plots/:plotId/book': holderOrCoordinator,
  'POST /api/plots/:plotId/plantings': holderOrCoordinator,
  'GET /api/plantings/:plantingId': holderOrCoordinator,
  'PATCH /api/plantings/:plantingId': holderOrCoordinator,
  'DELETE /api/plantings/:plantingId': holderOrCoordinator,
  'POST /api/plantings/:plantingId/harvests': holderOrCoordinator,
  'DELETE /api/harvests/:harvestId': holderOrCoordinator,
  'POST /api/plots/:plotId/observations': holderOrCoordinator,
  'DELETE /api/observations/:observationId': holderOrCoordinator,
  'POST /api/observations/:observationId/photos': holderOrCoordinator,
  'GET /api/observation-photos/:photoId': holderOrCoordinator,
  'GET /api/observation-photos/:photoId/thumb': holderOrCoordinator,
  // The weather log: members read; coordinators and this season's holders at the site write; coordinators delete
  'GET /api/clubs/:clubId/weather-sites': member,
  'GET /api/sites/:siteId/weather': recordMember,
  'PUT /api/sites/:siteId/weather/:day': holderOrCoordinator,
  'DELETE /api/sites/:siteId/weather/:day': recordCoordinator,
  'GET /api/sites/:siteId/weather.csv': recordMember,
  'GET /api/sites/:siteId/weather-imports/template.csv': recordMember,
  'POST /api/sites/:siteId/weather-imports': holderOrCoordinator,
  // Shifts
  'GET /api/clubs/:clubId/shifts': member,
  'GET /api/clubs/:clubId/shift-suggestions': coordinator,
  'POST /api/clubs/:clubId/shifts': coordinator,
  'GET /api/clubs/:clubId/my-shifts': member,
  'GET /api/clubs/:clubId/hours': coordinator,
  'GET /api/clubs/:clubId/hours.csv': coordinator,
  'GET /api/clubs/:clubId/volunteer-settings': member,
  'PUT /api/clubs/:clubId/volunteer-settings': member,
  'GET /api/clubs/:clubId/feeds': member,
  'POST /api/clubs/:clubId/feeds/personal': member,
  'POST /api/clubs/:clubId/feeds/club': coordinator,
  'GET /api/shifts/:shiftId': recordMember,
  'PATCH /api/shifts/:shiftId': recordCoordinator,
  'POST /api/shifts/:shiftId/call-off': recordCoordinator,
  'POST /api/shifts/:shiftId/claim': { rule: 'volunteer-or-coordinator' },
  'POST /api/shifts/:shiftId/release': recordMember, // acts on the caller's own place only
  'POST /api/shifts/:shiftId/done': recordMember, // acts on the caller's own place only
  'POST /api/shifts/:shiftId/ask-for-help': recordCoordinator,
  'GET /api/shifts/:shiftId/claims/:claimId/photo': { rule: 'owner-or-coordinator' },
  'GET /api/shift-links/preview': link(404),
  'POST /api/shift-links/claim': link(404),
  'POST /api/shift-links/release': link(404),
  'POST /api/shift-links/done': link(404),
  // Stop links of optional mail: the token is the only key (no sign-in, no CSRF: RFC 8058's one-click POST).
  'GET /api/mail-stops/:token': link(404),
  'POST /api/mail-stops/:token': link(404),
  'GET /api/feeds/:file': { rule: 'link-token', tokenAnswer: 200 }, // a real, secret feed address: no sign-in
};

type Expectation = 'pass' | 401 | 403 | 404;

/**
 * What each role must get under a rule: 'pass' is any answer but 401, 403 and 404 (a 400 for an empty
 * body still shows authorization let the request through). The volunteer, holder and coordinator are
 * club A's; the other coordinator is club B's. The holder holds the plot in the path this season; the
 * volunteer owns the shift place in the path (done photo); the holder owns the renewal.
 */
export function expected(entry: TableEntry, role: MatrixRole): Expectation | number {
  const row = (anonymous: Expectation, volunteer: Expectation, holder: Expectation, otherCoordinator: Expectation, coordinator: Expectation) =>
    ({ anonymous, volunteer, holder, otherCoordinator, coordinator })[role];
  switch (entry.rule) {
    case 'public':
      return 'pass';
    case 'link-token':
      return entry.tokenAnswer!;
    case 'signed-in':
      return row(401, 'pass', 'pass', 'pass', 'pass');
    case 'club-member':
      return row(401, 'pass', 'pass', 403, 'pass');
    case 'club-coordinator':
      return row(401, 403, 403, 403, 'pass');
    case 'record-member':
      return row(401, 'pass', 'pass', 404, 'pass');
    case 'record-coordinator':
      return row(401, 403, 403, 404, 'pass');
    case 'holder-or-coordinator':
      return row(401, 403, 'pass', 404, 'pass');
    case 'volunteer-or-coordinator':
      return row(401, 'pass', 403, 404, 'pass');
    case 'owner':
      return row(401, 404, 'pass', 404, 404);
    case 'owner-or-coordinator':
      return row(401, 'pass', 404, 404, 'pass');
  }
}
