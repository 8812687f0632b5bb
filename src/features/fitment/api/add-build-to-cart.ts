import { useMutation } from '@tanstack/react-query';
import type { CartView } from '../../../../shared/schemas/orders';
import { addToCart } from './add-to-cart';

export interface BuildCartLine {
  partNumber: string;
  quantity: number;
  /** Trade accounts only: take what is short as a back-order. */
  allowBackorder?: boolean;
}

/** A build that stopped part-way: the lines already in the cart stay there, and the message names the one that failed. */
export class BuildNotAddedError extends Error {
  constructor(
    message: string,
    readonly added: string[],
    readonly failed: string,
  ) {
    super(message);
  }
}

/**
 * Adds every line of a build, one after another, each carrying the saved check when there is one. The cart takes
 * a check per line only one line at a time, so the build goes in as a short run of requests.
 */
export async function addBuildToCart({ lines, fitmentId }: { lines: BuildCartLine[]; fitmentId: number | null }): Promise<CartView> {
  const added: string[] = [];
  let cart: CartView | null = null;
  for (const line of lines) {
    try {
      cart = await addToCart({
        partNumber: line.partNumber,
        quantity: line.quantity,
        ...(fitmentId !== null ? { fitmentId } : {}),
        ...(line.allowBackorder ? { allowBackorder: true } : {}),
      });
      added.push(line.partNumber);
    } catch (err) {
      const reason = err instanceof Error ? err.message : 'it was refused';
      throw new BuildNotAddedError(
        added.length === 0
          ? `Nothing was added: ${line.partNumber} was refused (${reason}).`
          : `${line.partNumber} was refused (${reason}). ${added.length} of ${lines.length} parts are in the cart; the rest are not.`,
        added,
        line.partNumber,
      );
    }
  }
  if (!cart) throw new Error('The build has no parts to add.');
  return cart;
}

/** The cart's queries belong to the cart feature, so the page passes in what to refresh. */
export const useAddBuildToCart = (onAdded?: () => unknown) =>
  useMutation({ mutationFn: addBuildToCart, onSettled: () => onAdded?.() });
