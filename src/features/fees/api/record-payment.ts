import { useMutation, useQueryClient } from '@tanstack/react-query';
import { FeeSchema, type Fee, type PaymentBody } from '@shared/schemas/fees';
import { apiFetch } from '@/lib/api/client';
import { useIdempotencyKeys } from '@/lib/api/idempotency';
import { feesKeys } from './keys';

/** POST /api/fees/:feeId/payments: a payment, or a refund of the deposit held; answers the updated fee. */
export function recordPayment(feeId: number, body: PaymentBody, idempotencyKey?: string): Promise<Fee> {
  return apiFetch(`/api/fees/${feeId}/payments`, { method: 'POST', body, schema: FeeSchema, idempotencyKey });
}

/** Records a payment and refreshes every fee list, whose totals it changes. */
export function useRecordPayment(feeId: number) {
  const queryClient = useQueryClient();
  const keys = useIdempotencyKeys();
  return useMutation({
    mutationFn: (body: PaymentBody) => recordPayment(feeId, body, keys.keyFor(body)),
    onSuccess: (_fee, body) => {
      keys.succeeded(body);
      return queryClient.invalidateQueries({ queryKey: feesKeys.all });
    },
  });
}
