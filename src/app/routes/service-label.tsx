import { useParams } from 'react-router-dom';
import { ServiceLabelPage } from '../../features/service/components/service-label';

export function ServiceLabelRoute() {
  const { reference = '' } = useParams();
  return <ServiceLabelPage reference={reference.toUpperCase()} />;
}
