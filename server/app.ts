import fs from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import expressStaticGzip from 'express-static-gzip';
import express from 'express';
import helmet from 'helmet';
import { rateLimit } from 'express-rate-limit';
import { toNodeHandler } from 'better-auth/node';
import type Stripe from 'stripe';
import type { Db } from './db/client';
import { sqliteRateLimitStore } from './db/shared-state';
import { TEST_CARDS } from '../shared/payment-test-methods';
import { apiNotFound, createErrorHandler } from './middleware/errors';
import { loadSession, refuseCrossSite } from './middleware/session';
import { authBodyLimit, authInputGuard, DEFAULT_SIGNIN_LIMITS, signInLimiters, uniformAnswers, type SignInLimits } from './middleware/auth-guard';
import { noStorePersonal } from './middleware/no-store';
import { fixedHeaders } from './middleware/fixed-headers';
import { accountRouter } from './routes/account';
import { adminDealersRouter } from './routes/admin-dealers';
import { adminPaymentsRouter } from './routes/admin-payments';
import { cartRouter, GUEST_CART_COOKIE } from './routes/cart';
import { devRouter } from './routes/dev';
import { fitmentRouter, savedFitmentsRouter } from './routes/fitment';
import { framesRouter } from './routes/frames';
import { checkoutRouter, ordersRouter } from './routes/orders';
import { partsRouter } from './routes/parts';
import { webhooksRouter } from './routes/webhooks';
import { warehouseRouter } from './routes/warehouse';
import { returnsRouter } from './routes/returns';
import { noticesRouter } from './routes/notices';
import { shaftLogsRouter } from './routes/shaft-logs';
import { adminCatalogRouter } from './routes/admin-catalog';
import { createWarehouseService } from './services/warehouse';
import { createLabelService } from './services/labels';
import { createUnitsService } from './services/units';
import { createServiceReminders } from './services/service-reminders';
import { createUnitHistories } from './services/unit-histories';
import { serviceIntervalsRouter, unitsRouter } from './routes/units';
import { createReturnsService } from './services/returns';
import { createCatalogAdmin } from './services/catalog-admin';
import { createAuditLogReader } from './services/audit-log';
import { storedPath } from './services/uploads';
import { HttpError } from './middleware/errors';
import { createAuth } from './services/auth';
import { createCartService } from './services/cart';
import { createCatalogService } from './services/catalog';
import type { MailerPort } from './services/mailer';
import { createNotifications } from './services/notifications';
import { createNotices, withNotices } from './services/notices';
import { createMailOutbox, type OutboxPolicy } from './services/mail-outbox';
import { adminMailRouter } from './routes/admin-mail';
import { createOrderService } from './services/orders';
import { createDealerAccountsService } from './services/dealer-accounts';
import { createDealerStatements } from './services/dealer-statement';
import { createFitmentService } from './services/fitment';
import { createShaftLogService } from './services/shaft-logs';
import { createSearchService } from './services/search';
import { createStockService } from './services/stock';
import { DEFAULT_TRACKING_URLS, type TrackingUrlPatterns } from '../shared/carriers';
import { createPartsListsService } from './services/parts-lists';
import { partsListsRouter } from './routes/parts-lists';
import { adminOfficeRouter } from './routes/admin-office';
import { benchRouter, serviceRouter } from './routes/service';
import { createServiceRequests, type ServiceRates } from './services/service-requests';
import { createServiceNotifier } from './services/service-notify';
import { DEFAULT_BALANCING_CENTS, DEFAULT_INSPECTION_FEE_CENTS, DEFAULT_LABOUR_RATE_CENTS } from '../shared/service';

export interface AppConfig {
  publicUrl: string;
  authSecret: string;
  taxRatePct: number;
  signinLimitPerMinute: number;
  paymentsMode: 'test' | 'live';
  publishableKey: string;
  webhookSecret: string;
  /** The payments fake's own address, for the development authentication step. */
  paymentsApiUrl: string;
  mailInboxUrl: string;
  /** Development tools: the inbox, the card step, demo accounts on the sign-in page. Off in production. */
  devTools: boolean;
  demoAccounts?: Array<{ role: string; email: string; password: string }>;
  trustedOrigins?: string[];
  /** Uploaded photos live here, outside the web root, under names the server makes. */
  uploadsDir: string;
  /** Per-account sign-in and reset limits; the defaults are in middleware/auth-guard.ts. */
  signinLimits?: Partial<Omit<SignInLimits, 'perAddressPerMinute'>>;
  /** Sign-up and reset answer no sooner than this after the request, known address or not. */
  uniformAnswerMs?: number;
  /** Anonymous order-pad checks (check, bulk add, file import) per client address per minute. */
  orderPadLimitPerMinute?: number;
  /** Carriers' tracking pages laid over the invented defaults (shared/carriers.ts). */
  trackingUrls?: TrackingUrlPatterns;
  /** The Bench's labour rate, inspection fee and balancing charge (defaults in shared/service.ts); tax is taxRatePct. */
  serviceRates?: Partial<Omit<ServiceRates, 'taxRatePct'>>;
}

/** Longer than the password hash and the database work of either path on a busy machine. */
const UNIFORM_ANSWER_MS = 600;
/** Order-pad checks, bulk adds and file imports per client address per minute. */
const ORDER_PAD_LIMIT_PER_MINUTE = 20;

export interface AppDeps {
  db: Db;
  payments: Stripe;
  mailer: MailerPort;
  config: AppConfig;
  /** Built client to serve; omitted in API-only tests. */
  clientDir?: string;
  now?: () => Date;
  log?: (err: unknown) => void;
  /** Retry timing of the mail outbox (tests shorten it); the worker is started by whoever runs the app. */
  mailPolicy?: Partial<OutboxPolicy>;
}

export function createApp(deps: AppDeps) {
  const { db, config } = deps;
  const log = deps.log ?? ((err: unknown) => console.error(err));
  const now = deps.now ?? (() => new Date());
  const trustedOrigins = [new URL(config.publicUrl).origin, ...(config.trustedOrigins ?? [])];

  const search = createSearchService(db, { log });
  search.rebuild();
  const catalog = createCatalogService(db, search);
  const stock = createStockService(db);
  const cart = createCartService(db, search, { taxRatePct: config.taxRatePct });
  const notifications = createNotifications({ db, publicUrl: config.publicUrl });
  const notices = createNotices({ db });
  const notify = withNotices(notifications, notices);
  const mailOutbox = createMailOutbox({ db, mailer: deps.mailer, policy: deps.mailPolicy });
  const dealers = createDealerAccountsService({
    db,
    notify: { applied: (tx, id) => notifications.dealerApplied(tx, id), decided: (tx, id, decision) => notifications.dealerDecided(tx, id, decision) },
  });
  const orders = createOrderService({ db, stock, cart, payments: deps.payments, notify: notify.orders, taxRatePct: config.taxRatePct, now, trackingUrls: { ...DEFAULT_TRACKING_URLS, ...config.trackingUrls } });
  const returnPhotosDir = path.join(config.uploadsDir, 'returns');
  const partPhotosDir = path.join(config.uploadsDir, 'parts');
  const units = createUnitsService({ db });
  const warehouse = createWarehouseService({ db, stock, notify: notify.warehouse, units });
  const returns = createReturnsService({ db, stock, payments: deps.payments, notify: notify.returns, photosDir: returnPhotosDir, taxRatePct: config.taxRatePct });
  // One fitment service: the check, the saved checks and the shaft logs share its parsed frames and map tables.
  const fitment = createFitmentService(db);
  const shaftLogs = createShaftLogService({ db, fitment });
  const reminders = createServiceReminders({ db, units, publicUrl: config.publicUrl });
  const unitHistories = createUnitHistories({ db, units, reminders, shaftLogs });
  const servicePhotosDir = path.join(config.uploadsDir, 'service');
  const service = createServiceRequests({
    db,
    stock,
    units,
    payments: deps.payments,
    notify: createServiceNotifier({ db, publicUrl: config.publicUrl, taxRatePct: config.taxRatePct }),
    photosDir: servicePhotosDir,
    rates: {
      labourRateCents: config.serviceRates?.labourRateCents ?? DEFAULT_LABOUR_RATE_CENTS,
      inspectionFeeCents: config.serviceRates?.inspectionFeeCents ?? DEFAULT_INSPECTION_FEE_CENTS,
      balancingCents: config.serviceRates?.balancingCents ?? DEFAULT_BALANCING_CENTS,
      taxRatePct: config.taxRatePct,
    },
    trackingUrls: { ...DEFAULT_TRACKING_URLS, ...config.trackingUrls },
  });
  const catalogAdmin = createCatalogAdmin({ db, refreshSearch: (ids) => search.refresh(ids), rebuildSearch: () => void search.rebuild({ background: true }) });
  const auth = createAuth({
    db,
    baseURL: config.publicUrl,
    secret: config.authSecret,
    trustedOrigins,
    secureCookies: config.publicUrl.startsWith('https://'),
    // Each is written to the mail outbox, so no answer waits for the mail server (and none is faster for it).
    sendResetPassword: async (to, url) => notifications.passwordReset(to, url),
    sendConfirmEmail: async (to, url) => notifications.accountConfirm(to, url),
    sendExistingAccountNotice: async (to) => notifications.existingAccountNotice(to),
    background: (task) => {
      task.catch((err: unknown) => log(err));
    },
  });

  const app = express();
  app.disable('x-powered-by');
  // The usual security headers; the page loads only its own scripts. Inline styles stay allowed for SVG charts
  // and for caught e-mails shown in a sandboxed frame. Helmet works them out once; every answer gets the same set.
  app.use(
    fixedHeaders(helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // Live mode loads the payment provider's card form from its own host (its documented origins, from memory).
          scriptSrc: ["'self'", ...(config.paymentsMode === 'live' ? ['https://js.stripe.com'] : [])],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'", ...(config.paymentsMode === 'live' ? ['https://api.stripe.com'] : [])],
          frameSrc: ["'self'", ...(config.paymentsMode === 'live' ? ['https://js.stripe.com', 'https://hooks.stripe.com'] : [])],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: config.publicUrl.startsWith('https://') ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
      hsts: config.publicUrl.startsWith('https://'),
    })),
  );
  // Answers made per request (JSON, the page) are compressed as the client accepts; built files come precompressed
  // and cached catalogue lists carry their compressed bytes (services/catalog.ts), so neither is compressed again.
  app.use(compression({ threshold: 1024 }));
  app.set('query parser', 'simple');
  app.set('trust proxy', 'loopback');

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });

  // Webhooks first: their signature is checked over the raw body, and they come from the payment service, not a browser.
  app.use('/api/webhooks', webhooksRouter({ payments: deps.payments, secret: config.webhookSecret, orders }));

  app.use('/api', refuseCrossSite(trustedOrigins));
  app.use('/api', noStorePersonal(['better-auth.session_token', GUEST_CART_COOKIE]));

  // The auth library's routes: a small body limit, our own schemas on its inputs, the sign-in and reset limits,
  // and answers to sign-up and reset that do not tell whether an account exists.
  const limiters = signInLimiters(db, { perAddressPerMinute: config.signinLimitPerMinute, ...DEFAULT_SIGNIN_LIMITS, ...config.signinLimits });
  app.use('/api/auth', ...authBodyLimit());
  app.use(['/api/auth/sign-in', '/api/auth/request-password-reset', '/api/auth/send-verification-email'], limiters.perAddress);
  app.use('/api/auth', authInputGuard());
  app.use('/api/auth/sign-in/email', limiters.signInPerAccount);
  app.use('/api/auth/request-password-reset', limiters.resetPerAccount);
  app.use('/api/auth', uniformAnswers(auth, config.publicUrl, config.uniformAnswerMs ?? UNIFORM_ANSWER_MS));
  const authHandler = toNodeHandler(auth);
  app.all('/api/auth/{*splat}', (req, res) => {
    void authHandler(req, res);
  });

  app.use('/api', express.json({ limit: '100kb' }), cookieParser(), loadSession(auth, db));
  // Checking a list of part numbers costs a look-up per row: one client address gets a few lists a minute.
  const orderPadLimiter = rateLimit({
    windowMs: 60_000,
    limit: config.orderPadLimitPerMinute ?? ORDER_PAD_LIMIT_PER_MINUTE,
    store: sqliteRateLimitStore(db, 'order-pad'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { message: 'Too many part lists checked from here in the last minute. Wait a minute and try again.' } });
    },
  });
  app.get('/api/parts/photos/:name', (req, res) => {
    const file = storedPath(partPhotosDir, String(req.params.name));
    if (!file) throw new HttpError(404, 'No such photo');
    // The uploads folder may sit under a dot-folder (.tmp in tests); storedPath has already checked the name.
    res.sendFile(file, { dotfiles: 'allow', headers: { 'Cache-Control': 'public, max-age=86400', 'X-Content-Type-Options': 'nosniff' } });
  });
  app.use('/api/parts', partsRouter(catalog));
  app.use('/api/frames', framesRouter(catalog));
  app.use(
    '/api/account',
    accountRouter({
      dealers,
      statements: createDealerStatements({ db, now }),
      payments: {
        mode: config.paymentsMode,
        publishableKey: config.publishableKey,
        ...(config.devTools ? { testMethods: Object.values(TEST_CARDS).map((c) => ({ id: c.id, label: c.label })) } : {}),
      },
      ...(config.devTools && config.demoAccounts ? { demoAccounts: config.demoAccounts } : {}),
    }),
  );
  app.use('/api/fitment', fitmentRouter({ fitment }));
  app.use('/api/fitments/:fitmentId/shaft-logs', shaftLogsRouter(shaftLogs));
  app.use('/api/fitments', savedFitmentsRouter({ fitment }));
  app.use(['/api/cart/check', '/api/cart/bulk', '/api/cart/import'], orderPadLimiter);
  app.use('/api/cart', cartRouter(cart));
  app.use('/api/checkout', checkoutRouter(orders, cart));
  app.use('/api/orders', ordersRouter(orders));
  app.use('/api/lists', partsListsRouter(createPartsListsService({ db, cart })));
  app.use('/api/warehouse', warehouseRouter({ db, warehouse, returns, labels: createLabelService(db) }));
  app.use('/api/returns', returnsRouter({ returns, photosDir: returnPhotosDir }));
  app.use('/api/notices', noticesRouter(notices));
  app.use('/api/service', serviceRouter({ service, photosDir: servicePhotosDir }));
  app.use('/api/bench', benchRouter({ service, photosDir: servicePhotosDir }));
  app.use('/api/admin', adminCatalogRouter({ admin: catalogAdmin, audit: createAuditLogReader({ db }), photosDir: partPhotosDir }));
  app.use('/api/admin/dealers', adminDealersRouter(dealers));
  app.use('/api/admin/mail', adminMailRouter(mailOutbox));
  app.use('/api/admin/payment-alerts', adminPaymentsRouter(orders));
  app.use('/api/admin/office', adminOfficeRouter(db));
  app.use('/api/admin/service-intervals', serviceIntervalsRouter(reminders));
  app.use('/api/units', unitsRouter(unitHistories));
  if (config.devTools) app.use('/api/dev', devRouter({ mailInboxUrl: config.mailInboxUrl, paymentsApiUrl: config.paymentsApiUrl, orders }));
  app.use('/api', apiNotFound);

  if (deps.clientDir && fs.existsSync(path.join(deps.clientDir, 'index.html'))) {
    const clientDir = deps.clientDir;
    // Built files are precompressed at build time (scripts/precompress.ts): brotli or gzip as the browser accepts.
    // Vite names every file under assets/ by its content, so those never change and are cached for a year; anything
    // else for an hour. The page itself is revalidated on every visit, so a new release is seen at once.
    app.use(
      expressStaticGzip(clientDir, {
        enableBrotli: true,
        orderPreference: ['br', 'gz'],
        index: false,
        serveStatic: {
          index: false,
          setHeaders: (res, file) => {
            const hashed = path.relative(clientDir, file).startsWith(`assets${path.sep}`);
            res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'public, max-age=3600');
          },
        },
      }),
    );
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(path.join(clientDir, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } });
    });
  }
  app.use(createErrorHandler(log));
  return { app, search, catalog, stock, cart, orders, dealers, auth, notifications, notices, mailOutbox, warehouse, returns, catalogAdmin, shaftLogs, fitment, units, reminders, unitHistories, service };
}
