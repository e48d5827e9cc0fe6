import { createBrowserRouter } from 'react-router-dom';
import { AppLayout } from './routes/app-layout';
import { FleetRoute } from './routes/fleet';
import { ImportRoute } from './routes/import';
import { TeamRoute } from './routes/team';
import { ReviewRoute } from './routes/review';
import { NotFoundRoute } from './routes/not-found';
import { RouteError } from './routes/route-error';

export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppLayout />,
    errorElement: <RouteError />,
    children: [
      { index: true, element: <FleetRoute /> },
      { path: 'import', element: <ImportRoute /> },
      { path: 'team', element: <TeamRoute /> },
      { path: 'flights/:flightId/:section?', element: <ReviewRoute /> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);
