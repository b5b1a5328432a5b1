import { useMemo, type ComponentProps } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { NeighbourCheck } from '@/features/findings/components/neighbour-check';
import { PlantingCheck } from '@/features/findings/components/planting-check';
import { WhatFits } from '@/features/findings/components/what-fits';
import { PlotBookPage } from '@/features/plot-book/components/plot-book-page';
import { TasksPanel } from '@/features/tasks/components/tasks-panel';
import type { NeighbourCheckSlots } from '@/features/plot-book/components/neighbour-check-slots';
import { useClubContext } from '../app-context';

// The plot book shows the neighbour check's parts and the season's tasks; features do not import each other, so they meet here.
const neighbourCheck: NeighbourCheckSlots = { PlantingCheck, NeighbourCheck, WhatFits };

/** `/clubs/:clubId/plots/:plotId/book?year=`: a plot's plot book; the server decides who may read or write it. */
export function PlotBookRoute() {
  const { club, user } = useClubContext();
  // The tasks panel keeps a Done pressed offline for this person (src/lib/offline).
  const Tasks = useMemo(() => {
    const userId = user.id;
    return function PersonTasks(props: ComponentProps<typeof TasksPanel>) {
      return <TasksPanel {...props} userId={userId} />;
    };
  }, [user.id]);
  const { plotId } = useParams();
  const [search] = useSearchParams();
  const year = Number(search.get('year'));
  return (
    <PlotBookPage
      key={`${plotId}-${year}`}
      clubId={club.clubId}
      plotId={Number(plotId)}
      year={Number.isInteger(year) && year >= 2000 && year <= 2100 ? year : undefined}
      isCoordinator={club.roles.includes('coordinator')}
      neighbourCheck={neighbourCheck}
      Tasks={Tasks}
    />
  );
}
