import type { Knex } from 'knex';
import { feeBalance, formatMoney } from '@shared/fees/compute';
import type { Fee, PaymentBody } from '@shared/schemas/fees';
import { AppError, notFound } from '../errors';
import { paymentReceiptMail } from '../mail/fee-templates';
import type { Mailer } from '../mail/mailer';
import { getFee } from './fee-ledger';
import { enqueueMail, kickMail } from './outbox';

/**
 * Records a payment against a fee, or a refund of the deposit held, then e-mails the holder a receipt.
 * The fee row is locked while the payments are summed, so two payments recorded at once are both
 * checked against what is really owed and both counted.
 */
export async function recordPayment(
  db: Knex,
  mailer: Mailer,
  opts: { feeId: number; userId: number; body: PaymentBody },
): Promise<Fee> {
  const { feeId, body } = opts;
  const fee = await db.transaction(async (trx) => {
    const fee = await trx('fees').where({ id: feeId }).forUpdate().first('id', 'plot_fee_minor', 'deposit_minor', 'currency');
    if (!fee) throw notFound('The fee');
    const payments = await trx('payments').where({ fee_id: feeId }).select('kind', 'amount_minor');
    const now = feeBalance(
      { plotFeeMinor: fee.plot_fee_minor, depositMinor: fee.deposit_minor },
      payments.map((p) => ({ kind: p.kind, amountMinor: p.amount_minor })),
    );
    const money = (minor: number) => formatMoney(minor, fee.currency);
    if (body.kind === 'refund' && body.amountMinor > now.depositHeldMinor) {
      throw new AppError('validation_failed', 'Only the deposit the club holds can be refunded.', {
        amountMinor: now.depositHeldMinor > 0 ? `At most ${money(now.depositHeldMinor)}, the deposit held` : 'No deposit is held for this fee',
      });
    }
    if (body.kind === 'payment' && body.amountMinor > now.balanceMinor) {
      throw new AppError('validation_failed', 'That is more than is owed.', {
        amountMinor: now.balanceMinor > 0 ? `At most ${money(now.balanceMinor)}, what is still owed` : 'This fee is fully paid',
      });
    }
    await trx('payments').insert({
      fee_id: feeId,
      kind: body.kind,
      amount_minor: body.amountMinor,
      method: body.method,
      paid_on: body.paidOn,
      note: body.note,
      recorded_by_user_id: opts.userId,
    });
    // The receipt is written with the payment; the outbox sends it, so a mail failure never fails the request.
    const saved = await getFee(trx, feeId);
    const club = await trx('fees as f').join('clubs as c', 'c.id', 'f.club_id').where('f.id', feeId).first('c.id', 'c.name');
    await enqueueMail(trx, { clubId: club.id, kind: 'payment_receipt' }, paymentReceiptMail({
      to: saved.holderEmail,
      name: saved.holderName,
      clubName: club.name,
      description: saved.description,
      currency: saved.currency,
      payment: body,
      balanceMinor: saved.balanceMinor,
      depositHeldMinor: saved.depositHeldMinor,
    }));
    return saved;
  });
  kickMail(db, mailer);
  return fee;
}
