import { ShieldBan } from 'lucide-react';
import { DeadEnd } from '@/components/ui/dead-end';

export interface NotAllowedProps {
  clubId: number;
  /** Why the page is closed to this person; each page says what only coordinators do there. */
  message: string;
  title?: string;
}

/** Shown instead of a page to someone in the club who lacks the role it needs. */
export function NotAllowed({ clubId, message, title = 'This page is for coordinators' }: NotAllowedProps) {
  return (
    <DeadEnd clubId={clubId} icon={ShieldBan} title={title}>
      <p>{message}</p>
    </DeadEnd>
  );
}
