import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import { DELIVERY_ZONE_KEYS } from '../../shared/pricing';
import { AddCartLineSchema, BulkCartLinesSchema, CSV_MAX_BYTES, CSV_MAX_ROWS, UpdateCartLineSchema } from '../../shared/schemas/orders';
import { z } from 'zod';
import { HttpError, parseOr400 } from '../middleware/errors';
import { currentUser, requireUser } from '../middleware/session';
import { buyerOf, type CartOwner, type CartService } from '../services/cart';

export const GUEST_CART_COOKIE = 'sy_cart';

/** The cart of whoever is asking: the signed-in user's, or the guest's by cookie (made on first add). */
export function cartOwner(req: Request, res: Response, cart: CartService, create: boolean): CartOwner | null {
  const user = currentUser(res);
  const guest = typeof req.cookies?.[GUEST_CART_COOKIE] === 'string' ? (req.cookies[GUEST_CART_COOKIE] as string) : null;
  if (user) {
    if (guest) {
      // First request after sign-in: the guest cart joins the user's cart.
      cart.mergeGuest(guest, user.id);
      res.clearCookie(GUEST_CART_COOKIE, { path: '/' });
    }
    return { userId: user.id };
  }
  if (guest && /^[\w-]{20,40}$/.test(guest)) return { guestToken: guest };
  if (!create) return null;
  const token = cart.newGuestToken();
  res.cookie(GUEST_CART_COOKIE, token, { httpOnly: true, sameSite: 'lax', path: '/', maxAge: 30 * 24 * 3600 * 1000, secure: req.secure });
  return { guestToken: token };
}

const emptyGuest: CartOwner = { guestToken: '' };

const CheckLinesSchema = z.object({
  lines: z
    .array(z.object({ partNumber: z.string().max(40), quantity: z.union([z.string().max(12), z.number().transform(String)]) }))
    .min(1, 'add at least one line')
    .max(CSV_MAX_ROWS, `at most ${CSV_MAX_ROWS} lines per check`),
});

export function cartRouter(cart: CartService): Router {
  const router = Router();
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: CSV_MAX_BYTES, files: 1 },
    fileFilter: (_req, file, cb) => {
      const ok = /\.(csv|txt)$/i.test(file.originalname) && /^(text\/(csv|plain)|application\/(vnd\.ms-excel|csv|octet-stream))$/.test(file.mimetype);
      if (ok) cb(null, true);
      else cb(new HttpError(415, 'Upload a CSV file (.csv) with columns part number and quantity'));
    },
  });

  router.get('/', (req, res) => {
    const owner = cartOwner(req, res, cart, false);
    res.json(cart.view(owner ?? emptyGuest, currentUser(res)));
  });

  router.post('/lines', (req, res) => {
    const input = parseOr400(AddCartLineSchema, req.body);
    const user = currentUser(res);
    if (input.allowBackorder && buyerOf(user).kind !== 'dealer') throw new HttpError(403, 'Back-orders are for trade accounts');
    const owner = cartOwner(req, res, cart, true)!;
    res.status(201).json(cart.addLines(owner, user, [input]));
  });

  router.post('/bulk', async (req, res) => {
    const input = parseOr400(BulkCartLinesSchema, req.body);
    const user = currentUser(res);
    const rows = await cart.validateRows(input.lines.map((l) => ({ partNumber: l.partNumber, quantity: String(l.quantity) })), buyerOf(user));
    const bad = rows.filter((r) => r.status === 'error');
    if (bad.length > 0) {
      throw new HttpError(400, `${bad.length} ${bad.length === 1 ? 'line needs' : 'lines need'} fixing`, Object.fromEntries(bad.map((r) => [`lines.${r.row - 1}`, [r.message ?? 'not valid']])));
    }
    const owner = cartOwner(req, res, cart, true)!;
    const dealer = buyerOf(user).kind === 'dealer';
    res.status(201).json(cart.addLines(owner, user, rows.map((r) => ({ partNumber: r.partNumber!, quantity: r.quantity!, allowBackorder: dealer && r.quantity! > (r.available ?? 0) }))));
  });

  router.post('/check', async (req, res) => {
    const input = parseOr400(CheckLinesSchema, req.body, `At most ${CSV_MAX_ROWS} lines per check`);
    const rows = await cart.validateRows(input.lines, buyerOf(currentUser(res)));
    res.json({ rows, validCount: rows.filter((r) => r.status !== 'error').length, errorCount: rows.filter((r) => r.status === 'error').length, maxRows: CSV_MAX_ROWS });
  });

  router.post('/import', (req, res, next) => {
    requireUser(res);
    upload.single('file')(req, res, (err: unknown) => {
      if (err) {
        if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, `The file is larger than ${CSV_MAX_BYTES / 1000} kB`));
        return next(err);
      }
      try {
        if (!req.file) throw new HttpError(400, 'Choose a CSV file to upload', { file: ['choose a CSV file'] });
        cart
          .readOrderFile(req.file.buffer.toString('utf8'), buyerOf(currentUser(res)))
          .then((rows) => res.json({ rows, validCount: rows.filter((r) => r.status !== 'error').length, errorCount: rows.filter((r) => r.status === 'error').length, maxRows: CSV_MAX_ROWS }), next);
      } catch (e) {
        next(e);
      }
    });
  });

  router.patch('/lines/:id', (req, res) => {
    const change = parseOr400(UpdateCartLineSchema, req.body);
    const owner = cartOwner(req, res, cart, false);
    if (!owner) throw new HttpError(404, 'No such line in your cart');
    res.json(cart.updateLine(owner, currentUser(res), Number(req.params.id), change));
  });

  router.delete('/lines/:id', (req, res) => {
    const owner = cartOwner(req, res, cart, false);
    if (!owner) throw new HttpError(404, 'No such line in your cart');
    res.json(cart.removeLine(owner, currentUser(res), Number(req.params.id)));
  });

  router.put('/delivery-zone', (req, res) => {
    const { zone } = parseOr400(z.object({ zone: z.enum(DELIVERY_ZONE_KEYS) }), req.body);
    res.json(cart.setZone(cartOwner(req, res, cart, true)!, currentUser(res), zone));
  });
  return router;
}
