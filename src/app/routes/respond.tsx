import { useSearchParams } from 'react-router-dom';
import { LinkResponse, answerOf } from '@/features/spring-round/components/link-response';

/** `/respond/offer?token=…&answer=accept|decline`: confirm accepting or declining a plot offer from its e-mail. */
export function OfferResponseRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Your plot offer · Tillwell</title>
      <LinkResponse kind="offer" token={params.get('token') ?? ''} chosen={answerOf('offer', params.get('answer'))} />
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
