import { useMutation, useQueryClient } from '@tanstack/react-query';
import { FeeSchema, type Fee, type PaymentBody } from '@shared/schemas/fees';
import { apiFetch } from '@/lib/api/client';
import { feesKeys } from './keys';

/** POST /api/fees/:feeId/payments: a payment, or a refund of the deposit held; answers the updated fee. */
export function recordPayment(feeId: number, body: PaymentBody): Promise<Fee> {
  return apiFetch(`/api/fees/${feeId}/payments`, { method: 'POST', body, schema: FeeSchema });
}

/** Records a payment and refreshes every fee list, whose totals it changes. */
export function useRecordPayment(feeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PaymentBody) => recordPayment(feeId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: feesKeys.all }),
  });
}
