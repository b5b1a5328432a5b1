/** Builds every in-app URL in one place so features can link to each other without importing each other. */
export const paths = {
  home: () => '/',
  signIn: () => '/sign-in',
  forgotPassword: () => '/forgot-password',
  club: (clubId: number) => `/clubs/${clubId}`,
  members: (clubId: number) => `/clubs/${clubId}/members`,
  map: (clubId: number, siteId?: number) => `/clubs/${clubId}/map${siteId ? `?site=${siteId}` : ''}`,
  sites: (clubId: number) => `/clubs/${clubId}/sites`,
  siteEdit: (clubId: number, siteId: number) => `/clubs/${clubId}/sites/${siteId}/edit`,
  sitePlots: (clubId: number, siteId: number) => `/clubs/${clubId}/sites/${siteId}/plots`,
  /** A site's printable map for the noticeboard; `query` carries the names choice ("?names=full"). */
  sitePrint: (clubId: number, siteId: number, query = '') => `/clubs/${clubId}/sites/${siteId}/print${query}`,
  /** The coordinators' tasks for the club: opens the first site's tasks. */
  tasks: (clubId: number) => `/clubs/${clubId}/tasks`,
  /** A site's tasks table (coordinators); `query` carries its filters ("?kind=water"). */
  siteTasks: (clubId: number, siteId: number, query = '') => `/clubs/${clubId}/sites/${siteId}/tasks${query}`,
  /** A site's water need, rain and deficit (every member). */
  siteWater: (clubId: number, siteId: number) => `/clubs/${clubId}/sites/${siteId}/water`,
  /** A site's daily weather log. */
  weather: (clubId: number, siteId: number) => `/clubs/${clubId}/sites/${siteId}/weather`,
  /** The quick rain entry; `siteId` picks the site first shown. */
  rainGauge: (clubId: number, siteId?: number) => `/clubs/${clubId}/rain-gauge${siteId ? `?site=${siteId}` : ''}`,
  plot: (clubId: number, plotId: number) => `/clubs/${clubId}/plots/${plotId}`,
  /** A plot's plot book; `year` picks an earlier season. */
  plotBook: (clubId: number, plotId: number, year?: number) => `/clubs/${clubId}/plots/${plotId}/book${year ? `?year=${year}` : ''}`,
  /** This season's plot book, at its Tasks panel. */
  plotBookTasks: (clubId: number, plotId: number) => `/clubs/${clubId}/plots/${plotId}/book#tasks`,
  crops: (clubId: number) => `/clubs/${clubId}/crops`,
  crop: (clubId: number, cropId: number) => `/clubs/${clubId}/crops/${cropId}`,
  /** The club's harvest figures per crop; `year` picks a season. */
  harvests: (clubId: number, year?: number) => `/clubs/${clubId}/harvests${year ? `?year=${year}` : ''}`,
  springRound: (clubId: number) => `/clubs/${clubId}/spring-round`,
  /** The coordinators' table of a season's neighbour check findings. */
  findings: (clubId: number) => `/clubs/${clubId}/findings`,
  waitlist: (clubId: number) => `/clubs/${clubId}/waitlist`,
  messages: (clubId: number) => `/clubs/${clubId}/messages`,
  outgoingMail: (clubId: number) => `/clubs/${clubId}/outgoing-mail`,
  /** Every e-mail template with a preview (coordinators). */
  mailTemplates: (clubId: number) => `/clubs/${clubId}/outgoing-mail/templates`,
  stopMail: (token: string) => `/stop-mail?token=${encodeURIComponent(token)}`,
  emailChoices: (clubId: number) => `/clubs/${clubId}/email-choices`,
  /** The public application form; shared with people who want a plot. */
  apply: (clubSlug: string) => `/apply/${encodeURIComponent(clubSlug)}`,
  fees: (clubId: number, year?: number) => `/clubs/${clubId}/fees${year ? `?year=${year}` : ''}`,
  clubSettings: (clubId: number) => `/clubs/${clubId}/settings`,
  myPlot: (clubId: number) => `/clubs/${clubId}/my-plot`,
  /** The page a renewal e-mail opens, for the signed-in holder by the renewal's id instead of the e-mailed token. */
  renewalAnswer: (renewalId: number) => `/respond/renewal?renewal=${renewalId}`,
  /** The shift board (every member); `query` carries its choices ("?date=2026-07-06&site=3"). */
  shifts: (clubId: number, query = '') => `/clubs/${clubId}/shifts${query}`,
  /** The printable rota of one week's shifts; `query` carries the board's choices ("?date=2026-07-06&site=3"). */
  shiftsPrint: (clubId: number, query = '') => `/clubs/${clubId}/shifts/print${query}`,
  shift: (clubId: number, shiftId: number) => `/clubs/${clubId}/shifts/${shiftId}`,
  /** The coordinators' "Build shifts" from the suggestions. */
  shiftPlan: (clubId: number) => `/clubs/${clubId}/shifts/plan`,
  /** A volunteer's own shifts, hours and shift e-mail choices. */
  myShifts: (clubId: number) => `/clubs/${clubId}/my-shifts`,
  /** The coordinators' table of volunteers' hours; `year` picks a season. */
  volunteerHours: (clubId: number, year?: number) => `/clubs/${clubId}/hours${year ? `?year=${year}` : ''}`,
  /** The page a shift e-mail's link opens (claim, give back or done), no sign-in needed. */
  shiftLink: (token: string) => `/shift-link?token=${encodeURIComponent(token)}`,
};
