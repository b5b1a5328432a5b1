import { useSearchParams } from 'react-router-dom';
import { RainGauge } from '@/features/weather/components/rain-gauge';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/rain-gauge?site=ID`: the quick rain entry for the sites the person may log weather at. */
export function RainGaugeRoute() {
  const { club, user } = useClubContext();
  const [params] = useSearchParams();
  return <RainGauge clubId={club.clubId} userId={user.id} initialSiteId={Number(params.get('site')) || undefined} />;
}
