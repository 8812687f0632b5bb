/** The most of one part a cart line, order line or list line may ask for; the quantity fields use it without the validation library. */
export const QUANTITY_MAX = 999;
