import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { MailCheck } from 'lucide-react';
import { currencies } from '@shared/schemas/clubs';
import { ClubSignupBodySchema, type ClubSignupBody } from '@shared/schemas/club-signups';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { currencyLabels, timeZoneNames } from '@/lib/club-choices';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { useRequestClubSignup } from '../api/club-signup';

function browserZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

/** A first guess from the browser's zone: US customary units and dollars in the US, else metric. */
function guesses(zone: string): Pick<ClubSignupBody, 'currency' | 'units'> {
  if (zone.startsWith('America/') && !/Toronto|Vancouver|Edmonton|Winnipeg|Halifax|Regina|St_Johns/.test(zone)) return { currency: 'USD', units: 'us' };
  if (zone.startsWith('America/')) return { currency: 'CAD', units: 'metric' };
  if (zone === 'Europe/London') return { currency: 'GBP', units: 'metric' };
  if (zone.startsWith('Australia/')) return { currency: 'AUD', units: 'metric' };
  if (zone === 'Pacific/Auckland') return { currency: 'NZD', units: 'metric' };
  return { currency: 'EUR', units: 'metric' };
}

const fieldNames = ['name', 'email', 'password', 'clubName', 'timeZone', 'currency', 'units'] as const;

/** `/start-a-club`: the first coordinator's details and the club's, then "check your e-mail". */
export function StartClubForm() {
  const zone = browserZone();
  const request = useRequestClubSignup();
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ClubSignupBodySchema),
    defaultValues: { name: '', email: '', password: '', clubName: '', timeZone: zone, ...guesses(zone) },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    request.mutate(values, {
      onSuccess: () => setSentTo(values.email),
      onError: (error) => setFormError(applyServerErrors(error, setError, fieldNames)),
    });
  });

  if (sentTo) {
    return (
      <div className="flex flex-col gap-4" role="status">
        <MailCheck className="size-11 text-leaf" aria-hidden="true" />
        <h1 className="text-2xl font-bold">Check your e-mail</h1>
        <p>
          We sent a link to <strong className="font-semibold">{sentTo}</strong>. Follow it within a day to confirm the address and start
          the club. Nothing is set up until you do.
        </p>
        <p className="text-sm text-stone">No e-mail after a few minutes? Look in the spam folder, or fill in the form again.</p>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Start a club</h1>
        <p className="mt-2">Set up your garden club on Tillwell. You will be its first coordinator and can invite others afterwards.</p>
      </div>
      {formError && <Alert tone="error">{formError}</Alert>}
      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 text-lg font-semibold">About you</legend>
        <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
        <TextField label="E-mail" type="email" autoComplete="email" hint="We send a link here to check it is yours." error={errors.email?.message} {...register('email')} />
        <TextField
          label="Password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters. If this address already has a Tillwell account, that account keeps its own password."
          error={errors.password?.message}
          {...register('password')}
        />
      </fieldset>
      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 text-lg font-semibold">About the club</legend>
        <TextField label="Club name" autoComplete="organization" error={errors.clubName?.message} {...register('clubName')} />
        <TextField
          label="Time zone"
          hint="Every date and time the club's people see is in this zone, e.g. Europe/London. We started from your browser's."
          list="start-club-time-zones"
          autoComplete="off"
          error={errors.timeZone?.message}
          {...register('timeZone')}
        />
        <datalist id="start-club-time-zones">
          {timeZoneNames.map((z) => (
            <option key={z} value={z} />
          ))}
        </datalist>
        <Select label="Currency" hint="Fees and receipts are in this currency. It is fixed once the first fee is recorded." error={errors.currency?.message} {...register('currency')}>
          {currencies.map((c) => (
            <option key={c} value={c}>
              {currencyLabels[c]}
            </option>
          ))}
        </Select>
        <Select label="Units" hint="What new sites start with; each site can still choose its own." error={errors.units?.message} {...register('units')}>
          <option value="metric">Metric (metres)</option>
          <option value="us">US customary (feet)</option>
        </Select>
      </fieldset>
      <Button type="submit" loading={request.isPending} loadingText="Sending…">
        Send the confirmation link
      </Button>
      <p className="text-sm">
        Already have an account?{' '}
        <Link to={paths.signIn()} className="underline">
          Sign in
        </Link>
      </p>
    </form>
  );
}
