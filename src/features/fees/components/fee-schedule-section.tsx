import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useFeeSchedule } from '../api/get-fee-schedule';
import { FeeScheduleForm } from './fee-schedule-form';

/** The fee schedule part of the settings page. */
export function FeeScheduleSection({ clubId, currency }: { clubId: number; currency: string }) {
  const schedule = useFeeSchedule(clubId);
  return (
    <section aria-labelledby="fee-schedule" className="min-w-0">
      <h2 id="fee-schedule" className="mb-1 text-xl font-semibold">
        Plot fees
      </h2>
      <p className="mb-4 text-stone">What a season on a plot costs. The fee is charged when someone accepts an offer or keeps their plot.</p>
      <Card>
        {schedule.isPending ? (
          <LoadingState label="Loading the fee schedule…" />
        ) : schedule.isError ? (
          <ErrorState
            message={schedule.error.message}
            requestId={isApiError(schedule.error) ? schedule.error.requestId : undefined}
            onRetry={() => void schedule.refetch()}
            retrying={schedule.isFetching}
          />
        ) : (
          <FeeScheduleForm clubId={clubId} schedule={schedule.data} currency={currency} />
        )}
      </Card>
    </section>
  );
}
