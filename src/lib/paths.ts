/** Builds every in-app URL in one place so features can link to each other without importing each other. */
export const paths = {
  home: () => '/',
  signIn: () => '/sign-in',
  forgotPassword: () => '/forgot-password',
  club: (clubId: number) => `/clubs/${clubId}`,
  members: (clubId: number) => `/clubs/${clubId}/members`,
  map: (clubId: number) => `/clubs/${clubId}/map`,
  springRound: (clubId: number) => `/clubs/${clubId}/spring-round`,
  myPlot: (clubId: number) => `/clubs/${clubId}/my-plot`,
  shifts: (clubId: number) => `/clubs/${clubId}/shifts`,
};
