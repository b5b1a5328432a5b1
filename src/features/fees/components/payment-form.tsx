import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { formatMoney } from '@shared/fees/compute';
import { paymentMethodLabels, paymentMethods, type Fee, type PaymentBody } from '@shared/schemas/fees';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useTimeZone } from '@/lib/time-zone';
import { useRecordPayment } from '../api/record-payment';
import { renameErrorFields } from '../lib/money-form';
import { emptyPayment, paymentFieldNames, paymentFormSchema, suggestedAmount, type PaymentFormValues } from '../lib/payment-form';

export interface PaymentFormProps {
  fee: Fee;
  onRecorded?: (fee: Fee, body: PaymentBody) => void;
}

/** Records one payment against a fee, or a refund of its deposit; the server e-mails the receipt. */
export function PaymentForm({ fee, onRecorded }: PaymentFormProps) {
  const record = useRecordPayment(fee.id);
  const timeZone = useTimeZone();
  const [formError, setFormError] = useState<string | null>(null);
  const schema = useMemo(() => paymentFormSchema(fee), [fee]);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    reset,
    formState: { errors },
  } = useForm<PaymentFormValues, unknown, PaymentBody>({
    resolver: zodResolver(schema),
    defaultValues: emptyPayment(fee, timeZone),
  });

  const kind = register('kind', {
    onChange: (event: { target: { value: PaymentBody['kind'] } }) =>
      setValue('amount', suggestedAmount(fee, event.target.value), { shouldValidate: false }),
  });

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    record.mutate(body, {
      onSuccess: (updated) => {
        reset({ ...emptyPayment(updated, timeZone), method: body.method, paidOn: body.paidOn });
        onRecorded?.(updated, body);
      },
      onError: (error) =>
        setFormError(applyServerErrors(renameErrorFields(error, { amountMinor: 'amount' }), setError, paymentFieldNames)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="grid gap-5 sm:grid-cols-2">
        <Select label="Kind" error={errors.kind?.message} {...kind}>
          <option value="payment">Payment</option>
          <option value="refund" disabled={fee.depositHeldMinor <= 0}>
            Deposit refund{fee.depositHeldMinor > 0 ? ` (up to ${formatMoney(fee.depositHeldMinor, fee.currency)})` : ' (no deposit held)'}
          </option>
        </Select>
        <TextField
          label="Amount"
          hint={`In ${fee.currency}, like 20.00`}
          inputMode="decimal"
          autoComplete="off"
          error={errors.amount?.message}
          {...register('amount')}
        />
        <Select label="Method" error={errors.method?.message} {...register('method')}>
          {paymentMethods.map((m) => (
            <option key={m} value={m}>
              {paymentMethodLabels[m]}
            </option>
          ))}
        </Select>
        <TextField label="Date paid" type="date" error={errors.paidOn?.message} {...register('paidOn')} />
      </div>
      <TextField label="Note (optional)" hint="For example a cheque number." autoComplete="off" error={errors.note?.message} {...register('note')} />
      <Button type="submit" loading={record.isPending} loadingText="Recording…" className="self-start">
        Record
      </Button>
    </form>
  );
}
