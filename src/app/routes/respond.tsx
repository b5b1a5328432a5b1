import { useSearchParams } from 'react-router-dom';
import { LinkResponse } from '@/features/spring-round/components/link-response';

/** `/respond/offer?token=…`: accept or decline a plot offer from its e-mail. */
export function OfferResponseRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Your plot offer · Tillwell</title>
      <LinkResponse kind="offer" token={params.get('token') ?? ''} />
    </>
  );
}

/** `/respond/renewal?token=…`: keep or give up last season's plot. */
export function RenewalResponseRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Keep your plot? · Tillwell</title>
      <LinkResponse kind="renewal" token={params.get('token') ?? ''} />
    </>
  );
}
