/**
 * The schemas of the answers to what a visitor does on the shop's first pages (add to the cart, open or add to a
 * list, run or save a fitment check, open a saved one), with the validation library they need. A request names its
 * schema as `() => import('…/action-schemas').then(...)`, so they arrive beside its answer, never with a page: the
 * first visit's budget (tests/integration/client-budget.test.ts) counts this chunk as waiting for the visitor.
 */
export { CartViewSchema } from '../../shared/schemas/orders';
export { AddToListResultSchema, ListsSchema } from '../../shared/schemas/parts-lists';
export { FitmentResponseSchema } from '../../shared/schemas/fitment';
export { SavedFitmentSchema } from '../../shared/schemas/saved-fitments';
