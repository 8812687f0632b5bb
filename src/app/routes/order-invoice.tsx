import { useParams } from 'react-router-dom';
import { Invoice } from '../../features/orders/components/invoice';

export function OrderInvoiceRoute() {
  const { number = '' } = useParams();
  return <Invoice number={number} />;
}
