import { FirstRunChecklist } from '@/features/clubs/components/first-run-checklist';
import { SeasonGlance } from '@/features/season-summary/components/season-glance';

/** What the coordinator's section of the home shows above its cards, in one lazy chunk: the first-run checklist, then the season. */
export function CoordinatorHome({ clubId }: { clubId: number }) {
  return (
    <>
      <FirstRunChecklist clubId={clubId} />
      <SeasonGlance clubId={clubId} />
    </>
  );
}
