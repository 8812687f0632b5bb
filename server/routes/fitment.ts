import { Router } from 'express';
import type { Db } from '../db/client';

/** POST /api/fitment — replaced by the fitment check's implementation. */
export function fitmentRouter(_deps: { db: Db }): Router {
  return Router();
}

/** /api/fitments — a signed-in user's saved checks. */
export function savedFitmentsRouter(_deps: { db: Db }): Router {
  return Router();
}
