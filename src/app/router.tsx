import { createBrowserRouter } from 'react-router-dom';
import { AccountRoute } from './routes/account';
import { AppLayout } from './routes/app-layout';
import { DevMailRoute } from './routes/dev-mail';
import { FleetRoute } from './routes/fleet';
import { InviteRoute } from './routes/invite';
import { NewAircraftRoute } from './routes/new-aircraft';
import { NewTeamRoute } from './routes/new-team';
import { NotFoundRoute } from './routes/not-found';
import { ResetConfirmRoute } from './routes/reset-confirm';
import { ResetRequestRoute } from './routes/reset-request';
import { RouteError } from './routes/route-error';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { TeamRoute } from './routes/team';

// The heavy screens (charts, the log reader) load on first visit; the service worker precaches
// their chunks, so they open offline too.
const lazyImport = async () => ({ Component: (await import('./routes/import')).ImportRoute });
const lazyReview = async () => ({ Component: (await import('./routes/review')).ReviewRoute });
const lazyAircraft = async () => ({ Component: (await import('./routes/aircraft')).AircraftRoute });

export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppLayout />,
    errorElement: <RouteError />,
    // Shown while a lazy screen's code loads on the first page of a visit.
    hydrateFallbackElement: <p className="p-4 text-sm text-ink-soft">Opening Hoverprint…</p>,
    children: [
      { index: true, element: <FleetRoute /> },
      { path: 'import', lazy: lazyImport },
      { path: 'team', element: <TeamRoute /> },
      { path: 'teams/new', element: <NewTeamRoute /> },
      { path: 'aircraft/new', element: <NewAircraftRoute /> },
      { path: 'aircraft/:aircraftId/:section?', lazy: lazyAircraft },
      { path: 'flights/:flightId/:section?', lazy: lazyReview },
      { path: 'sign-in', element: <SignInRoute /> },
      { path: 'sign-up', element: <SignUpRoute /> },
      { path: 'reset', element: <ResetRequestRoute /> },
      { path: 'reset/:token', element: <ResetConfirmRoute /> },
      { path: 'invite/:token', element: <InviteRoute /> },
      { path: 'account', element: <AccountRoute /> },
      { path: 'dev/mail', element: <DevMailRoute /> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);
