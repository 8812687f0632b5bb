import { lazy, useLayoutEffect, useRef, useState, useTransition, type ComponentType } from 'react';
import { matchRoutes, Route, Router, Routes, UNSAFE_createBrowserHistory as createBrowserHistory, type Location, type Params } from 'react-router-dom';
import { Layout } from './layout';
import { NavigationPending } from './navigation-pending';
import { ErrorScreen } from './page-outlet';
import { framesQueryOptions } from '../features/catalog/api/get-frames';
import { frameQueryOptions } from '../features/catalog/api/get-frame';
import { partQueryOptions } from '../features/catalog/api/get-part';
import { partsQueryOptions } from '../features/catalog/api/get-parts';
import { catalogueQueryFrom } from '../features/catalog/catalogue-query';
import { frameMapsQueryOptions } from '../features/fitment/api/get-frame-maps';
import { queryClient } from '../lib/query-client';

type Loader = () => Promise<Record<string, unknown>>;
/** Starts a page's first requests; the page reads them through the same query keys. */
type Prefetch = (args: { params: Params; search: URLSearchParams }) => unknown;

interface Page {
  path: string | null;
  /** Starts (or joins) the download of the page's chunk. */
  load: () => Promise<ComponentType>;
  /** The page, drawn once its chunk is here; replaced after a failed download, so a later visit tries again. */
  Component: ComponentType;
  prefetch?: Prefetch;
}

/**
 * Each page is its own chunk so the first page stays small. A page with a prefetch starts its data at the same moment
 * as its chunk, on the first address and on each navigation to it (see `startPage`); the page shows its own loading
 * state if the data is still on its way, and filter changes within a page are left to the query cache.
 */
function page(path: string | null, load: Loader, exportName: string, prefetch?: Prefetch): Page {
  let loading: Promise<ComponentType> | null = null;
  const entry: Page = {
    path,
    prefetch,
    load: () =>
      (loading ??= load().then(
        (m) => m[exportName] as ComponentType,
        (err: unknown) => {
          loading = null;
          entry.Component = lazyPage();
          throw err;
        },
      )),
    Component: () => null,
  };
  const lazyPage = () => lazy(() => entry.load().then((C) => ({ default: C })));
  entry.Component = lazyPage();
  return entry;
}

const PAGES: Page[] = [
  page(null, () => import('./routes/home'), 'HomeRoute', () => queryClient.prefetchQuery(framesQueryOptions())),
  page('catalogue', () => import('./routes/catalogue'), 'CatalogueRoute', ({ search }) => queryClient.prefetchQuery(partsQueryOptions(catalogueQueryFrom(search)))),
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
];

const ROUTES = PAGES.map((p) => (p.path === null ? { index: true, page: p } : { path: p.path, page: p }));

/** Starts the chunk and the first requests of the page an address leads to. */
export function startPage(location: Pick<Location, 'pathname' | 'search'>) {
  const match = matchRoutes(ROUTES, location.pathname)?.at(-1);
  if (!match) return;
  const { page: found } = match.route;
  // A failed download or early start is no error here: the page asks again when it renders, and shows what went wrong.
  found.load().catch(() => undefined);
  if (found.prefetch) Promise.resolve(found.prefetch({ params: match.params, search: new URLSearchParams(location.search) })).catch(() => undefined);
}

function PageElement({ page }: { page: Page }) {
  const { Component: Page } = page;
  return <Page />;
}

const history = createBrowserHistory({ v5Compat: true });

export function AppRouter() {
  const [state, setState] = useState({ action: history.action, location: history.location });
  const [pending, startTransition] = useTransition();
  const last = useRef(history.location.pathname);
  useLayoutEffect(
    () =>
      history.listen(({ action, location }) => {
        const samePage = location.pathname === last.current;
        last.current = location.pathname;
        // A change of filters on the same page is the page's own: drawn at once (its controls follow the address), its
        // data left to the query cache.
        if (samePage) return setState({ action, location });
        // Another page: its chunk and data leave now, not once it has rendered, and the page on screen stays (with the
        // header's loading bar) until the next one can be drawn.
        startPage(location);
        startTransition(() => setState({ action, location }));
      }),
    [],
  );
  return (
    <Router location={state.location} navigationType={state.action} navigator={history}>
      <NavigationPending value={pending}>
        <ErrorScreen locationKey={state.location.key}>
          <Routes>
            <Route element={<Layout />}>
              {PAGES.map((p) =>
                p.path === null ? <Route key="index" index element={<PageElement page={p} />} /> : <Route key={p.path} path={p.path} element={<PageElement page={p} />} />,
              )}
            </Route>
          </Routes>
        </ErrorScreen>
      </NavigationPending>
    </Router>
  );
}
