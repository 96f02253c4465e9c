import type { RouteObject } from 'react-router-dom';
import { paths } from '../config/paths';
import { AppShell } from '../components/app-shell';
import { RouteError } from '../routes/route-error';
import { Loading } from '../components/loading';

/** The route table: one lazily loaded module per screen under src/routes/. */
export const routes: RouteObject[] = [
  {
    path: paths.home,
    element: <AppShell />,
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading />,
    children: [
      { index: true, lazy: () => import('../routes/home') },
      { path: paths.signIn, lazy: () => import('../routes/sign-in') },
      { path: '*', lazy: () => import('../routes/not-found') },
    ],
  },
];
