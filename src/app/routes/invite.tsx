import { useSearchParams } from 'react-router-dom';
import { InviteAccept } from '@/features/auth/components/invite-accept';

/** `/invite?token=…`. */
export function InviteRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Your invite · Tillwell</title>
      <InviteAccept token={params.get('token')} />
    </>
  );
}
