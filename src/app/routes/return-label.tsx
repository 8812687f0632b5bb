import { useParams } from 'react-router-dom';
import { ReturnLabelPage } from '../../features/returns/components/return-label';

export function ReturnLabelRoute() {
  const { reference = '' } = useParams();
  return <ReturnLabelPage reference={reference.toUpperCase()} />;
}
