import { useSearchParams } from 'react-router-dom';
import { ShiftLinkPage } from '@/features/shifts/components/link-page';

/** `/shift-link?token=…`: take a place, give it back or say a shift is done, from an e-mailed link; no sign-in. */
export function ShiftLinkRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Your shift · Tillwell</title>
      <ShiftLinkPage token={params.get('token')} />
    </>
  );
}
