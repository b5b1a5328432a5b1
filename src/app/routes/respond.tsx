import { useSearchParams } from 'react-router-dom';
import { parseIdText } from '@shared/schemas/common';
import { LinkResponse, answerOf } from '@/features/spring-round/components/link-response';

/** `/respond/offer?token=…&answer=accept|decline`: confirm accepting or declining a plot offer from its e-mail. */
export function OfferResponseRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Your plot offer · Tillwell</title>
      <LinkResponse kind="offer" linkRef={params.get('token') ? { token: params.get('token')! } : null} chosen={answerOf('offer', params.get('answer'))} />
    </>
  );
}

/**
 * `/respond/renewal?token=…` (from the e-mail) or `?renewal=ID` (from the club home, signed in):
 * keep or give up last season's plot.
 */
export function RenewalResponseRoute() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const renewalId = parseIdText(params.get('renewal'));
  return (
    <>
      <title>Keep your plot? · Tillwell</title>
      <LinkResponse kind="renewal" linkRef={token ? { token } : renewalId !== null ? { renewalId } : null} />
    </>
  );
}
