import { z } from 'zod';
import { PART_STATUSES } from '../allowed-values';
import { QUANTITY_MAX } from './orders';

export const LIST_NAME_MAX = 60;
export const LIST_LINES_MAX = 300;
export const LISTS_PER_ACCOUNT_MAX = 100;

const quantity = z
  .number({ error: 'quantity must be a number' })
  .int('quantity must be a whole number')
  .min(1, 'quantity must be at least 1')
  .max(QUANTITY_MAX, `quantity must be at most ${QUANTITY_MAX}`);

export const ListNameSchema = z
  .string({ error: 'give the list a name' })
  .trim()
  .min(1, 'give the list a name')
  .max(LIST_NAME_MAX, `a list name is at most ${LIST_NAME_MAX} characters`);

export const CreateListSchema = z.object({ name: ListNameSchema });
export type CreateList = z.infer<typeof CreateListSchema>;

/**
 * What goes onto a list: one part (from its page), the buyer's cart, or a past order of theirs. Into an existing list
 * by id, or a new one by name.
 */
export const AddToListSchema = z
  .object({
    listId: z.number().int().positive().optional(),
    newListName: ListNameSchema.optional(),
    source: z.discriminatedUnion('kind', [
      z.object({ kind: z.literal('part'), partNumber: z.string().trim().min(2).max(40), quantity }),
      z.object({ kind: z.literal('cart') }),
      z.object({ kind: z.literal('order'), orderNumber: z.string().trim().min(2).max(20) }),
    ]),
  })
  .refine((v) => (v.listId === undefined) !== (v.newListName === undefined), { message: 'choose a list or name a new one', path: ['listId'] });
export type AddToList = z.infer<typeof AddToListSchema>;

export const UpdateListSchema = z.object({ name: ListNameSchema });
export const UpdateListLineSchema = z.object({ quantity });

/** Order the chosen lines of a list at the chosen quantities: they go into the cart. */
export const OrderFromListSchema = z.object({
  lines: z.array(z.object({ lineId: z.number().int().positive(), quantity })).min(1, 'choose at least one line').max(LIST_LINES_MAX),
});
export type OrderFromList = z.infer<typeof OrderFromListSchema>;

export const ListSummarySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  lineCount: z.number().int(),
  unitCount: z.number().int(),
  updatedAt: z.string(),
  updatedByName: z.string().nullable(),
});
export type ListSummary = z.infer<typeof ListSummarySchema>;
export const ListsSchema = z.object({ items: z.array(ListSummarySchema) });

export const ListLineSchema = z.object({
  id: z.number().int(),
  partNumber: z.string(),
  title: z.string(),
  status: z.enum(PART_STATUSES),
  supersededBy: z.string().nullable(),
  quantity: z.number().int(),
  available: z.number().int(),
  unitCents: z.number().int(),
  addedByName: z.string().nullable(),
});
export type ListLine = z.infer<typeof ListLineSchema>;

export const ListDetailSchema = ListSummarySchema.extend({ lines: z.array(ListLineSchema), createdByName: z.string().nullable() });
export type ListDetail = z.infer<typeof ListDetailSchema>;

export const AddToListResultSchema = z.object({ list: ListSummarySchema, added: z.number().int(), notices: z.array(z.string()) });
export type AddToListResult = z.infer<typeof AddToListResultSchema>;

export const OrderFromListResultSchema = z.object({ added: z.number().int(), notices: z.array(z.string()) });
