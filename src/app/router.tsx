import { createBrowserRouter } from 'react-router-dom';
import { LoadingState } from '@/components/ui/spinner';
import { AppShell } from './routes/app-shell';
import { AuthShell, SignedOutOnly } from './routes/auth-shell';
import { ClubHomeRoute } from './routes/club-home';
import { ClubScope } from './routes/club-scope';
import { HomeRedirect } from './routes/home-redirect';
import { NotFoundRoute } from './routes/not-found';
import { RouteError } from './routes/route-error';

function PageLoading() {
  return <LoadingState fullPage label="Loading…" />;
}

/** Every route in the app; form pages and the members table load on demand. */
export const router = createBrowserRouter([
  {
    path: '/',
    ErrorBoundary: RouteError,
    HydrateFallback: PageLoading,
    children: [
      {
        Component: AuthShell,
        children: [
          {
            Component: SignedOutOnly,
            children: [
              { path: 'sign-in', lazy: () => import('./routes/sign-in').then((m) => ({ Component: m.SignInRoute })) },
              {
                path: 'forgot-password',
                lazy: () => import('./routes/forgot-password').then((m) => ({ Component: m.ForgotPasswordRoute })),
              },
            ],
          },
          // Open to everyone: a signed-in person may still follow a reset or invite e-mail.
          {
            path: 'reset-password',
            lazy: () => import('./routes/reset-password').then((m) => ({ Component: m.ResetPasswordRoute })),
          },
          // Starting a club, and (with ?token=) its e-mailed link: open to everyone.
          { path: 'start-a-club', lazy: () => import('./routes/start-club') },
          { path: 'invite', lazy: () => import('./routes/invite').then((m) => ({ Component: m.InviteRoute })) },
          // The waiting list form is public: anyone may apply, signed in or not.
          { path: 'apply/:clubSlug', lazy: () => import('./routes/apply').then((m) => ({ Component: m.ApplyRoute })) },
          {
            path: 'respond/offer',
            lazy: () => import('./routes/respond').then((m) => ({ Component: m.OfferResponseRoute })),
          },
          {
            path: 'respond/renewal',
            lazy: () => import('./routes/respond').then((m) => ({ Component: m.RenewalResponseRoute })),
          },
          // A shift e-mail's link (take a place, give it back, say it is done): no sign-in, opening it changes nothing.
          { path: 'shift-link', lazy: () => import('./routes/shift-link').then((m) => ({ Component: m.ShiftLinkRoute })) },
          // An optional e-mail's stop link: no sign-in, opening it changes nothing until the button is pressed.
          { path: 'stop-mail', lazy: () => import('./routes/stop-mail').then((m) => ({ Component: m.StopMailRoute })) },
        ],
      },
      {
        Component: AppShell,
        children: [
          { index: true, Component: HomeRedirect },
          {
            path: 'clubs/:clubId',
            Component: ClubScope,
            children: [
              { index: true, Component: ClubHomeRoute },
              { path: 'members', lazy: () => import('./routes/members').then((m) => ({ Component: m.MembersRoute })) },
              { path: 'sites', lazy: () => import('./routes/sites').then((m) => ({ Component: m.SitesRoute })) },
              {
                path: 'sites/:siteId/edit',
                lazy: () => import('./routes/site-edit').then((m) => ({ Component: m.SiteEditRoute })),
              },
              {
                path: 'sites/:siteId/plots',
                lazy: () => import('./routes/site-plots').then((m) => ({ Component: m.SitePlotsRoute })),
              },
              {
                path: 'sites/:siteId/print',
                lazy: () => import('./routes/site-print').then((m) => ({ Component: m.SitePrintRoute })),
              },
              {
                path: 'sites/:siteId/weather',
                lazy: () => import('./routes/weather').then((m) => ({ Component: m.WeatherRoute })),
              },
              {
                path: 'sites/:siteId/tasks',
                lazy: () => import('./routes/site-tasks').then((m) => ({ Component: m.SiteTasksRoute })),
              },
              {
                path: 'sites/:siteId/water',
                lazy: () => import('./routes/site-water').then((m) => ({ Component: m.SiteWaterRoute })),
              },
              { path: 'tasks', lazy: () => import('./routes/tasks').then((m) => ({ Component: m.TasksRoute })) },
              { path: 'rain-gauge', lazy: () => import('./routes/rain-gauge').then((m) => ({ Component: m.RainGaugeRoute })) },
              { path: 'plots/:plotId', lazy: () => import('./routes/plot').then((m) => ({ Component: m.PlotRoute })) },
              { path: 'plots/:plotId/book', lazy: () => import('./routes/plot-book').then((m) => ({ Component: m.PlotBookRoute })) },
              { path: 'crops', lazy: () => import('./routes/crops').then((m) => ({ Component: m.CropsRoute })) },
              { path: 'crops/:cropId', lazy: () => import('./routes/crop').then((m) => ({ Component: m.CropRoute })) },
              { path: 'harvests', lazy: () => import('./routes/harvests').then((m) => ({ Component: m.HarvestsRoute })) },
              { path: 'findings', lazy: () => import('./routes/findings').then((m) => ({ Component: m.FindingsRoute })) },
              { path: 'map', lazy: () => import('./routes/map').then((m) => ({ Component: m.MapRoute })) },
              { path: 'fees', lazy: () => import('./routes/fees').then((m) => ({ Component: m.FeesRoute })) },
              {
                path: 'settings',
                lazy: () => import('./routes/club-settings').then((m) => ({ Component: m.ClubSettingsRoute })),
              },
              {
                path: 'waitlist',
                lazy: () => import('./routes/waitlist').then((m) => ({ Component: m.WaitlistRoute })),
              },
              { path: 'messages', lazy: () => import('./routes/messages').then((m) => ({ Component: m.MessagesRoute })) },
              {
                path: 'outgoing-mail',
                lazy: () => import('./routes/outgoing-mail').then((m) => ({ Component: m.OutgoingMailRoute })),
              },
              {
                path: 'outgoing-mail/templates',
                lazy: () => import('./routes/mail-templates').then((m) => ({ Component: m.MailTemplatesRoute })),
              },
              {
                path: 'email-choices',
                lazy: () => import('./routes/email-choices').then((m) => ({ Component: m.EmailChoicesRoute })),
              },
              {
                path: 'spring-round',
                lazy: () => import('./routes/spring-round').then((m) => ({ Component: m.SpringRoundRoute })),
              },
              { path: 'my-plot', lazy: () => import('./routes/my-plot').then((m) => ({ Component: m.MyPlotRoute })) },
              { path: 'shifts', lazy: () => import('./routes/shifts').then((m) => ({ Component: m.ShiftsRoute })) },
              { path: 'shifts/print', lazy: () => import('./routes/shifts-print').then((m) => ({ Component: m.ShiftsPrintRoute })) },
              { path: 'shifts/plan', lazy: () => import('./routes/shift-plan').then((m) => ({ Component: m.ShiftPlanRoute })) },
              { path: 'shifts/:shiftId', lazy: () => import('./routes/shift').then((m) => ({ Component: m.ShiftRoute })) },
              { path: 'my-shifts', lazy: () => import('./routes/my-shifts').then((m) => ({ Component: m.MyShiftsRoute })) },
              { path: 'hours', lazy: () => import('./routes/hours').then((m) => ({ Component: m.HoursRoute })) },
            ],
          },
        ],
      },
      { path: '*', Component: NotFoundRoute },
    ],
  },
]);
