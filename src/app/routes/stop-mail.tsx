import { useSearchParams } from 'react-router-dom';
import { StopMailPage } from '@/features/mailings/components/stop-mail-page';

/** `/stop-mail?token=…`: stop one kind of optional e-mail from its link, after a confirm; no sign-in. */
export function StopMailRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Stop e-mails · Tillwell</title>
      <StopMailPage token={params.get('token')} />
    </>
  );
}
