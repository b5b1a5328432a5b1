import { formatMoney } from '@shared/fees/compute';
import type { Fee } from '@shared/schemas/fees';

/** What a fee's balance means in words: owed, settled, or paid beyond what was due. */
export function BalanceText({ fee }: { fee: Pick<Fee, 'balanceMinor' | 'currency'> }) {
  if (fee.balanceMinor > 0) {
    return <span className="font-semibold whitespace-nowrap text-clay-700 tabular-nums">{formatMoney(fee.balanceMinor, fee.currency)} owed</span>;
  }
  if (fee.balanceMinor < 0) {
    return <span className="whitespace-nowrap tabular-nums">{formatMoney(-fee.balanceMinor, fee.currency)} over</span>;
  }
  return <span className="font-semibold whitespace-nowrap text-leaf-800">Paid</span>;
}
