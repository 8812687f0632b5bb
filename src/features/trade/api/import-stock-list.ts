import { useMutation } from '@tanstack/react-query';
import { ImportPreviewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';

export const importStockList = (file: File) => {
  const formData = new FormData();
  formData.append('file', file);
  return api('/cart/import', ImportPreviewSchema, { method: 'POST', formData });
};

export const useImportStockList = () => useMutation({ mutationFn: importStockList });
