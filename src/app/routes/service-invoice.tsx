import { useParams } from 'react-router-dom';
import { ServiceInvoicePage } from '../../features/service/components/service-invoice';

export function ServiceInvoiceRoute() {
  const { reference = '' } = useParams();
  return <ServiceInvoicePage reference={reference.toUpperCase()} />;
}
