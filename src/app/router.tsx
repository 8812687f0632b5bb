import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { Layout } from './layout';
import { RouteError } from './route-error';
import { LoadingState } from '../components/ui/states';

type Loader = () => Promise<Record<string, unknown>>;

/** Each page is its own chunk so the first page stays small. */
const page = (path: string, load: Loader, exportName: string): RouteObject => ({
  path,
  errorElement: <RouteError />,
  lazy: async () => ({ Component: (await load())[exportName] as React.ComponentType }),
});

const router = createBrowserRouter([
  {
    element: <Layout />,
    errorElement: <RouteError />,
    // Shown while the first page's code arrives.
    hydrateFallbackElement: (
      <div className="mx-auto max-w-6xl px-4 py-10">
        <LoadingState label="Loading Spoolyard…" />
      </div>
    ),
    children: [
      { index: true, lazy: async () => ({ Component: (await import('./routes/home')).HomeRoute }) },
      page('catalogue', () => import('./routes/catalogue'), 'CatalogueRoute'),
      page('parts/:partNumber', () => import('./routes/part'), 'PartRoute'),
      page('fitment', () => import('./routes/fitment'), 'FitmentRoute'),
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
      page('office/dealers', () => import('./routes/office-dealers'), 'OfficeDealersRoute'),
      page('office/payment-alerts', () => import('./routes/office-payment-alerts'), 'OfficePaymentAlertsRoute'),
      page('returns', () => import('./routes/returns'), 'ReturnsRoute'),
      page('returns/new', () => import('./routes/return-new'), 'ReturnNewRoute'),
      page('floor', () => import('./routes/floor-queue'), 'FloorQueueRoute'),
      page('floor/pick', () => import('./routes/floor-pick'), 'FloorPickRoute'),
      page('floor/orders/:number/pack', () => import('./routes/floor-pack'), 'FloorPackRoute'),
      page('floor/orders/:number/slip', () => import('./routes/floor-slip'), 'FloorSlipRoute'),
      page('floor/goods-in', () => import('./routes/floor-goods-in'), 'FloorGoodsInRoute'),
      page('floor/stock', () => import('./routes/floor-stock'), 'FloorStockRoute'),
      page('floor/returns', () => import('./routes/floor-returns'), 'FloorReturnsRoute'),
      page('office/parts', () => import('./routes/office-parts'), 'OfficePartsRoute'),
      page('office/parts/new', () => import('./routes/office-part-edit'), 'OfficePartEditRoute'),
      page('office/parts/:partNumber', () => import('./routes/office-part-edit'), 'OfficePartEditRoute'),
      page('office/price-imports', () => import('./routes/office-price-imports'), 'OfficePriceImportsRoute'),
      page('office/mail', () => import('./routes/office-mail'), 'OfficeMailRoute'),
      page('office/audit', () => import('./routes/office-audit'), 'OfficeAuditRoute'),
      page('account/statement', () => import('./routes/account-statement'), 'AccountStatementRoute'),
      page('dev/inbox', () => import('./routes/dev-inbox'), 'DevInboxRoute'),
      { path: '*', lazy: async () => ({ Component: (await import('./routes/not-found')).NotFoundRoute }) },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
