import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { Layout } from './layout';
import { RouteError } from './route-error';

// Each page is its own chunk so the first page stays small.
const router = createBrowserRouter([
  {
    element: <Layout />,
    errorElement: <RouteError />,
    children: [
      { index: true, lazy: async () => ({ Component: (await import('./routes/home')).HomeRoute }) },
      { path: 'catalogue', lazy: async () => ({ Component: (await import('./routes/catalogue')).CatalogueRoute }), errorElement: <RouteError /> },
      { path: 'parts/:partNumber', lazy: async () => ({ Component: (await import('./routes/part')).PartRoute }), errorElement: <RouteError /> },
      { path: 'fitment', lazy: async () => ({ Component: (await import('./routes/fitment')).FitmentRoute }), errorElement: <RouteError /> },
      { path: '*', lazy: async () => ({ Component: (await import('./routes/not-found')).NotFoundRoute }) },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
