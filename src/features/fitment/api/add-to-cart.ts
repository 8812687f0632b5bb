import { CartViewSchema, type AddCartLine } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';

/** Adds a part to the cart, carrying the saved check's id so the order shows what the part was chosen for. */
export const addToCart = (line: AddCartLine) => api('/cart/lines', CartViewSchema, { method: 'POST', body: line });
