import { useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';

export function ReviewRoute() {
  const { flightId } = useParams();
  return <PageHeader title="Review" lead={`Flight ${flightId ?? ''}`} />;
}
