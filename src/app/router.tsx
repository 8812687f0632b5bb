import { createBrowserRouter, RouterProvider, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Layout } from './layout';
import { RouteError } from './route-error';
import { LoadingState } from '../components/ui/states';
import { framesQueryOptions } from '../features/catalog/api/get-frames';
import { frameQueryOptions } from '../features/catalog/api/get-frame';
import { partQueryOptions } from '../features/catalog/api/get-part';
import { partsQueryOptions } from '../features/catalog/api/get-parts';
import { frameMapsQueryOptions } from '../features/fitment/api/get-frame-maps';
import { queryClient } from '../lib/query-client';

type Loader = () => Promise<Record<string, unknown>>;
/** Starts a page's first requests; the page reads them through the same query keys. */
type Prefetch = (args: LoaderFunctionArgs) => unknown;

/** Holds the page's place (the footer stays below the fold) while its code arrives on a first visit. */
const pageFallback = (
  <div className="min-h-screen">
    <LoadingState label="Loading the page…" />
  </div>
);

/**
 * Each page is its own chunk so the first page stays small. A page with a prefetch gets a loader that starts its data
 * at the same moment as its chunk, and returns at once: the page shows its own loading state if the data is still on
 * its way, and later visits and filter changes are left to the query cache (no loader re-runs).
 */
function page(path: string | null, load: Loader, exportName: string, prefetch?: Prefetch): RouteObject {
  const route = {
    errorElement: <RouteError />,
    hydrateFallbackElement: pageFallback,
    ...(prefetch && {
      loader: (args: LoaderFunctionArgs) => {
        // A failed early start is no error: the page asks again when it renders, and shows what went wrong.
        Promise.resolve(prefetch(args)).catch(() => undefined);
        return null;
      },
      shouldRevalidate: () => false,
    }),
    lazy: async () => ({ Component: (await load())[exportName] as React.ComponentType }),
  };
  return path === null ? { index: true, ...route } : { path, ...route };
}

const prefetchCatalogue: Prefetch = async ({ request }) => {
  // Reading the filters needs the validation library, which the page's own chunk needs too.
  const { catalogueQueryFrom } = await import('../features/catalog/catalogue-query');
  return queryClient.prefetchQuery(partsQueryOptions(catalogueQueryFrom(new URL(request.url).searchParams)));
};

const router = createBrowserRouter([
  {
    element: <Layout />,
    errorElement: <RouteError />,
    children: [
      page(null, () => import('./routes/home'), 'HomeRoute', () => queryClient.prefetchQuery(framesQueryOptions())),
      page('catalogue', () => import('./routes/catalogue'), 'CatalogueRoute', prefetchCatalogue),
      page('parts/:partNumber', () => import('./routes/part'), 'PartRoute', ({ params }) => queryClient.prefetchQuery(partQueryOptions(params.partNumber ?? ''))),
      page('frames/:code', () => import('./routes/frame'), 'FrameRoute', ({ params }) => queryClient.prefetchQuery(frameQueryOptions((params.code ?? '').toUpperCase()))),
      page('fitment', () => import('./routes/fitment'), 'FitmentRoute', () => queryClient.prefetchQuery(frameMapsQueryOptions())),
      page('fitment/saved', () => import('./routes/saved-fitments'), 'SavedFitmentsRoute'),
      page('fitment/saved/:id/logs', () => import('./routes/shaft-logs'), 'ShaftLogsRoute'),
      page('sign-in', () => import('./routes/sign-in'), 'SignInRoute'),
      page('sign-up', () => import('./routes/sign-up'), 'SignUpRoute'),
      page('forgot-password', () => import('./routes/forgot-password'), 'ForgotPasswordRoute'),
      page('reset-password', () => import('./routes/reset-password'), 'ResetPasswordRoute'),
      page('account', () => import('./routes/account'), 'AccountRoute'),
      page('account/trade-application', () => import('./routes/dealer-apply'), 'DealerApplyRoute'),
      page('cart', () => import('./routes/cart'), 'CartRoute'),
      page('checkout', () => import('./routes/checkout'), 'CheckoutRoute'),
      page('orders', () => import('./routes/orders'), 'OrdersRoute'),
      page('orders/:number', () => import('./routes/order'), 'OrderRoute'),
      page('orders/:number/invoice', () => import('./routes/order-invoice'), 'OrderInvoiceRoute'),
      page('trade/quick-order', () => import('./routes/quick-order'), 'QuickOrderRoute'),
      page('trade/stock-list', () => import('./routes/stock-list-upload'), 'StockListUploadRoute'),
      page('trade/lists', () => import('./routes/lists'), 'ListsRoute'),
      page('trade/lists/:id', () => import('./routes/list'), 'ListRoute'),
      page('office/dealers', () => import('./routes/office-dealers'), 'OfficeDealersRoute'),
      page('office/payment-alerts', () => import('./routes/office-payment-alerts'), 'OfficePaymentAlertsRoute'),
      page('returns', () => import('./routes/returns'), 'ReturnsRoute'),
      page('returns/new', () => import('./routes/return-new'), 'ReturnNewRoute'),
      page('returns/:reference/label', () => import('./routes/return-label'), 'ReturnLabelRoute'),
      page('service', () => import('./routes/service'), 'ServiceRoute'),
      page('service/new', () => import('./routes/service-new'), 'ServiceNewRoute'),
      page('service/:reference', () => import('./routes/service-request'), 'ServiceRequestRoute'),
      page('service/:reference/label', () => import('./routes/service-label'), 'ServiceLabelRoute'),
      page('service/:reference/invoice', () => import('./routes/service-invoice'), 'ServiceInvoiceRoute'),
      page('bench', () => import('./routes/bench'), 'BenchRoute'),
      page('floor', () => import('./routes/floor-queue'), 'FloorQueueRoute'),
      page('floor/pick', () => import('./routes/floor-pick'), 'FloorPickRoute'),
      page('floor/orders/:number/pack', () => import('./routes/floor-pack'), 'FloorPackRoute'),
      page('floor/orders/:number/slip', () => import('./routes/floor-slip'), 'FloorSlipRoute'),
      page('floor/goods-in', () => import('./routes/floor-goods-in'), 'FloorGoodsInRoute'),
      page('floor/stock', () => import('./routes/floor-stock'), 'FloorStockRoute'),
      page('floor/returns', () => import('./routes/floor-returns'), 'FloorReturnsRoute'),
      page('floor/labels', () => import('./routes/floor-labels'), 'FloorLabelsRoute'),
      page('office/parts', () => import('./routes/office-parts'), 'OfficePartsRoute'),
      page('office/parts/new', () => import('./routes/office-part-edit'), 'OfficePartEditRoute'),
      page('office/parts/:partNumber', () => import('./routes/office-part-edit'), 'OfficePartEditRoute'),
      page('office/price-imports', () => import('./routes/office-price-imports'), 'OfficePriceImportsRoute'),
      page('office/mail', () => import('./routes/office-mail'), 'OfficeMailRoute'),
      page('office', () => import('./routes/office-index'), 'OfficeIndexRoute'),
      page('notices', () => import('./routes/notices'), 'NoticesRoute'),
      page('office/audit', () => import('./routes/office-audit'), 'OfficeAuditRoute'),
      page('email-confirmed', () => import('./routes/email-confirmed'), 'EmailConfirmedRoute'),
      page('account/statement', () => import('./routes/account-statement'), 'AccountStatementRoute'),
      page('account/units', () => import('./routes/my-units'), 'MyUnitsRoute'),
      page('units/:serial', () => import('./routes/unit'), 'UnitRoute'),
      page('office/service-intervals', () => import('./routes/office-service-intervals'), 'OfficeServiceIntervalsRoute'),
      page('dev/inbox', () => import('./routes/dev-inbox'), 'DevInboxRoute'),
      page('*', () => import('./routes/not-found'), 'NotFoundRoute'),
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
