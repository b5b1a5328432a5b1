import { useCallback, useMemo, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CloudRain, Minus, Plus, Table2 } from 'lucide-react';
import { roundTo } from '@shared/geometry';
import type { WeatherSite } from '@shared/schemas/weather';
import { formatWeather, weatherUnitLabel } from '@shared/weather';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { TextField } from '@/components/ui/field';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { useWeatherLog } from '../api/get-weather-log';
import { useWeatherSites } from '../api/get-weather-sites';
import { usePutWeatherDay, weatherDayPath } from '../api/put-weather-day';
import { weatherKeys } from '../api/keys';
import { isOffline, putEntry } from '@/lib/offline/queue';
import { useOfflineQueue } from '@/lib/offline/use-offline-queue';
import { WaitingToSend } from '@/components/offline/waiting-to-send';
import { rainText, shortDayText, temperatureText } from '../lib/format';
import { weatherFormSchema, type WeatherFormResult, type WeatherFormValues } from '../lib/weather-form';

const KEYS = ['rainMm', 'tMinC', 'tMaxC'] as const;
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

/** The step of the big buttons: 1 mm, or 0.05 in on a US site (common practice for hand-read gauges). */
const stepOf = (units: WeatherSite['units']) => (units === 'us' ? 0.05 : 1);

/** What the log already holds for the chosen day, so the person knows whether saving replaces a reading. */
function StoredDay({ site, day }: { site: WeatherSite; day: string }) {
  const valid = /^\d{4}-\d{2}-\d{2}$/.test(day) && day <= site.today && day >= '2000-01-01';
  const log = useWeatherLog(site.id, { from: day, to: day }, { enabled: valid });
  if (!valid) return null;
  const current = log.data && log.data.from === day ? log.data : null;
  if (!current) {
    return (
      <p className="text-sm text-stone" role="status">
        Looking up {shortDayText(day, site.today)}…
      </p>
    );
  }
  const stored = current.days[0];
  if (!stored) return <p className="text-sm text-stone">Nothing is logged for {shortDayText(day, site.today)} yet.</p>;
  const parts = [rainText(stored, site.units), temperatureText(stored, site.units)].filter(Boolean);
  return (
    <p className="text-sm text-stone">
      Logged for {shortDayText(day, site.today)}: {parts.length ? parts.join(', ') : 'other values only'}. Saving replaces the rain
      {stored.tMinC !== null || stored.tMaxC !== null ? ' (and any temperature you type)' : ''} and keeps the rest.
    </p>
  );
}

function GaugeForm({ site, userId }: { site: WeatherSite; userId: number }) {
  const save = usePutWeatherDay(site.id);
  const queryClient = useQueryClient();
  const refresh = useCallback(() => void queryClient.invalidateQueries({ queryKey: weatherKeys.site(site.id) }), [queryClient, site.id]);
  const queue = useOfflineQueue(userId, `rain-gauge:${site.id}`, refresh);
  const [saved, setSaved] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const schema = useMemo(
    () => weatherFormSchema({ keys: KEYS, units: site.units, blank: 'omit', required: ['rainMm'], today: site.today }),
    [site.units, site.today],
  );
  const {
    register,
    control,
    handleSubmit,
    setValue,
    getValues,
    setError,
    formState: { errors },
  } = useForm<WeatherFormValues, unknown, WeatherFormResult>({
    resolver: zodResolver(schema),
    defaultValues: { day: site.today, rainMm: '', tMinC: '', tMaxC: '' },
  });
  const day = useWatch({ control, name: 'day' });
  const rainUnit = weatherUnitLabel('rain', site.units);
  const tempUnit = weatherUnitLabel('temperature', site.units);
  const step = stepOf(site.units);
  const stepWords = site.units === 'us' ? '0.05 in' : '1 mm';

  const nudge = (sign: 1 | -1) => {
    const text = (getValues('rainMm') ?? '').trim();
    const current = NUMBER.test(text) ? Number(text) : 0;
    const next = Math.max(0, roundTo(current + sign * step, 2));
    setValue('rainMm', String(next), { shouldDirty: true, shouldValidate: Boolean(errors.rainMm) });
    setSaved(null);
  };

  const submit = handleSubmit((form) => {
    setSaved(null);
    setFormError(null);
    // Made on pressing save: a queued copy sent later carries the same key, so it is recorded once.
    const key = crypto.randomUUID();
    const body = { ...form.values, source: 'gauge' as const };
    save.mutate(
      { day: form.day, body, key },
      {
        onSuccess: (result) => {
          const rain = result.rainMm === null ? 'No rain' : formatWeather('rain', result.rainMm, site.units);
          setSaved(`${rain} on ${shortDayText(result.day, site.today)} saved`);
        },
        // What was typed stays in the form; the server's words go beside the inputs they are about.
        onError: (error) => {
          if (isOffline(error)) {
            const rain = body.rainMm == null ? 'No rain' : formatWeather('rain', Number(body.rainMm), site.units);
            const entry = {
              key,
              page: `rain-gauge:${site.id}`,
              userId,
              method: 'PUT' as const,
              path: weatherDayPath(site.id, form.day),
              body,
              label: `${rain} on ${shortDayText(form.day, site.today)}`,
              createdAt: new Date().toISOString(),
            };
            putEntry(entry).then(
              () => setSaved(null),
              () => setFormError('No connection, and this phone could not keep the entry.'),
            );
            return;
          }
          setFormError(applyServerErrors(error, setError, ['day', ...KEYS]));
        },
      },
    );
  });

  return (
    <form onSubmit={(event) => void submit(event)} noValidate className="flex flex-col gap-5">
      <TextField
        label="Day"
        type="date"
        min="2000-01-01"
        max={site.today}
        error={errors.day?.message}
        {...register('day', { onChange: () => setSaved(null) })}
      />
      <StoredDay site={site} day={day} />

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1.5 font-medium text-soil">Rain in the gauge ({rainUnit})</legend>
        <div className="grid grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)_minmax(0,1fr)] items-stretch gap-2">
          <button
            type="button"
            onClick={() => nudge(-1)}
            className="flex min-h-16 flex-col items-center justify-center rounded-xl border border-stone bg-white px-1 text-sm font-semibold text-soil hover:bg-paper-100 active:bg-paper-200"
          >
            <Minus className="size-7" aria-hidden="true" />
            Less {stepWords}
          </button>
          <TextField
            label={<span className="sr-only">Rain ({rainUnit})</span>}
            inputMode="decimal"
            autoComplete="off"
            placeholder="0"
            className="[&_input]:min-h-16 [&_input]:text-center [&_input]:text-2xl [&_input]:font-semibold"
            error={errors.rainMm?.message}
            {...register('rainMm', { onChange: () => setSaved(null) })}
          />
          <button
            type="button"
            onClick={() => nudge(1)}
            className="flex min-h-16 flex-col items-center justify-center rounded-xl border border-leaf bg-leaf-50 px-1 text-sm font-semibold text-leaf-800 hover:bg-leaf-100 active:bg-leaf-100"
          >
            <Plus className="size-7" aria-hidden="true" />
            More {stepWords}
          </button>
        </div>
      </fieldset>

      <details className="rounded-lg border border-paper-200 bg-paper p-3">
        <summary className="min-h-11 cursor-pointer content-center font-medium text-soil">Add the lowest and highest temperature (optional)</summary>
        <div className="mt-3 grid grid-cols-2 gap-3">
          <TextField label={`Lowest (${tempUnit})`} inputMode="decimal" autoComplete="off" error={errors.tMinC?.message} {...register('tMinC')} />
          <TextField label={`Highest (${tempUnit})`} inputMode="decimal" autoComplete="off" error={errors.tMaxC?.message} {...register('tMaxC')} />
        </div>
      </details>

      <div aria-live="polite" className="empty:hidden">
        {saved && (
          <Alert tone="success" announce={false}>
            {saved}
          </Alert>
        )}
      </div>
      <WaitingToSend entries={queue.entries} sending={queue.sending} onRetry={() => void queue.retry()} onDiscard={(k) => void queue.discard(k)} />
      {formError && <Alert tone="error">{formError} What you typed is still here; try again.</Alert>}
      <Button type="submit" className="min-h-14 w-full text-lg" loading={save.isPending} loadingText="Saving…">
        <CloudRain className="size-6" aria-hidden="true" />
        Save
      </Button>
    </form>
  );
}

export interface RainGaugeProps {
  clubId: number;
  /** The signed-in person: entries kept offline are theirs only. */
  userId: number;
  /** The site to show first (from the address), when the person may log there. */
  initialSiteId?: number;
}

/** The quick rain entry for a phone: pick the site and day, tap the rain in, save. */
export function RainGauge({ clubId, userId, initialSiteId }: RainGaugeProps) {
  const sites = useWeatherSites(clubId);
  const [chosen, setChosen] = useState<number | null>(null);

  const header = (
    <PageHeader eyebrow="Weather log" title="Rain gauge" description="Read the gauge, tap in what it holds, save. Empty the gauge after reading it." />
  );
  if (sites.isPending) {
    return (
      <>
        {header}
        <LoadingState label="Loading your sites…" />
      </>
    );
  }
  if (sites.isError) {
    return (
      <>
        {header}
        <ErrorState
          message={sites.error.message}
          requestId={isApiError(sites.error) ? sites.error.requestId : undefined}
          onRetry={() => void sites.refetch()}
          retrying={sites.isFetching}
        />
      </>
    );
  }
  const writable = sites.data.items.filter((s) => s.canWrite);
  if (writable.length === 0) {
    return (
      <>
        {header}
        <Card>
          <EmptyState icon={CloudRain} title="No site to log rain for">
            <p>Plot holders log the rain at the site where they have a plot this season, and coordinators at every site.</p>
          </EmptyState>
        </Card>
      </>
    );
  }
  const site = writable.find((s) => s.id === (chosen ?? initialSiteId)) ?? writable[0];

  return (
    <div className="mx-auto w-full max-w-md">
      <title>{`Rain gauge · ${site.name} · Tillwell`}</title>
      {header}
      <Card className="flex flex-col gap-5">
        {writable.length > 1 ? (
          <Select label="Site" value={site.id} onChange={(event) => setChosen(Number(event.target.value))}>
            {writable.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </Select>
        ) : (
          <p className="font-medium text-soil">{site.name}</p>
        )}
        <GaugeForm key={site.id} site={site} userId={userId} />
      </Card>
      <Link to={paths.weather(clubId, site.id)} className="mt-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
        <Table2 className="size-5" aria-hidden="true" />
        The weather log for {site.name}
      </Link>
    </div>
  );
}
