import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { PAYMENT_TERMS_DAYS } from '../../../../shared/schemas/account-replies';
import { DealerDecisionSchema, type DealerDecision } from '../../../../shared/schemas/accounts';
import { parseMoneyToCents } from '../../../../shared/format';
import { DEALER_TIER_KEYS, DEALER_TIERS } from '../../../../shared/pricing';
import { buttonClass } from '../../../components/ui/button';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextAreaField, TextField } from '../../../components/ui/form';
import { useDecideDealer } from '../api/decide-dealer';


const ApproveFormSchema = z.object({
  tier: z.enum(DEALER_TIER_KEYS, { error: 'choose a trade tier' }),
  creditLimit: z
    .string()
    .trim()
    .min(1, 'enter a credit limit in dollars')
    .refine((v) => parseMoneyToCents(v) !== null, 'enter dollars and cents, for example 7500 or 7,500.00')
    .refine((v) => (parseMoneyToCents(v) ?? 0) <= 1_000_000_00, 'credit limit is too high (at most $1,000,000)'),
  paymentTermsDays: z.enum(PAYMENT_TERMS_DAYS.map(String) as [string, ...string[]], { error: 'choose payment terms' }),
});
type ApproveForm = z.infer<typeof ApproveFormSchema>;

const DeclineFormSchema = DealerDecisionSchema.options[1].omit({ decision: true });
type DeclineForm = z.infer<typeof DeclineFormSchema>;

export interface DecisionDone {
  dealerId: number;
  companyName: string;
  decision: DealerDecision;
}

export function ApproveDealerForm({ dealerId, companyName, onDone }: { dealerId: number; companyName: string; onDone: (d: DecisionDone) => void }) {
  const base = useId();
  const ids = { tier: `${base}-tier`, creditLimit: `${base}-credit`, paymentTermsDays: `${base}-terms` };
  const form = useForm<ApproveForm>({ shouldFocusError: false, resolver: zodResolver(ApproveFormSchema), defaultValues: { creditLimit: '', paymentTermsDays: '30' } });
  const decide = useDecideDealer();
  const errors = form.formState.errors;
  const summary = useErrorSummary(form, [
    { name: 'tier', id: ids.tier, label: 'Trade tier' },
    { name: 'creditLimit', id: ids.creditLimit, label: 'Credit limit' },
    { name: 'paymentTermsDays', id: ids.paymentTermsDays, label: 'Payment terms' },
  ]);

  const onSubmit = summary.handleSubmit(
    (values) => {
      const decision = DealerDecisionSchema.parse({
        decision: 'approve',
        tier: values.tier,
        creditLimitCents: parseMoneyToCents(values.creditLimit),
        paymentTermsDays: Number(values.paymentTermsDays),
      });
      decide.mutate({ id: dealerId, decision }, { onSuccess: () => onDone({ dealerId, companyName, decision }), onError: (error) => summary.showServerError(error) });
    },
    () => decide.reset(),
  );

  return (
    <form noValidate onSubmit={onSubmit} aria-label={`Approve ${companyName}`} className="grid content-start gap-3 rounded-md border border-machined/50 bg-white p-4">
      <h3 className="text-lg font-bold">Approve</h3>
      {summary.shown && <ErrorSummary variant="compact" {...summary.props} />}
      <SelectField id={ids.tier} label="Trade tier" error={errors.tier?.message} defaultValue="" {...form.register('tier')}>
        <option value="" disabled>
          Choose a tier
        </option>
        {DEALER_TIER_KEYS.map((t) => (
          <option key={t} value={t}>
            {DEALER_TIERS[t].label} — {DEALER_TIERS[t].discountPct} % off
          </option>
        ))}
      </SelectField>
      <TextField
        id={ids.creditLimit}
        label="Credit limit"
        hint="In dollars. Orders on account stop when the open balance would pass it."
        error={errors.creditLimit?.message}
        prefix="$"
        affix="addon"
        inputMode="decimal"
        autoComplete="off"
        className="tabular"
        {...form.register('creditLimit')}
      />
      <SelectField id={ids.paymentTermsDays} label="Payment terms" error={errors.paymentTermsDays?.message} {...form.register('paymentTermsDays')}>
        {PAYMENT_TERMS_DAYS.map((d) => (
          <option key={d} value={String(d)}>
            Net {d} days
          </option>
        ))}
      </SelectField>
      <div>
        <button type="submit" className={buttonClass('primary')} disabled={decide.isPending}>
          {decide.isPending ? 'Approving…' : `Approve ${companyName}`}
        </button>
      </div>
    </form>
  );
}

export function DeclineDealerForm({ dealerId, companyName, onDone }: { dealerId: number; companyName: string; onDone: (d: DecisionDone) => void }) {
  const id = `${useId()}-reason`;
  const form = useForm<DeclineForm>({ shouldFocusError: false, resolver: zodResolver(DeclineFormSchema), defaultValues: { reason: '' } });
  const decide = useDecideDealer();
  const errors = form.formState.errors;
  const summary = useErrorSummary(form, [{ name: 'reason', id, label: 'Reason' }]);

  const onSubmit = summary.handleSubmit(
    ({ reason }) => {
      const decision: DealerDecision = { decision: 'decline', reason };
      decide.mutate({ id: dealerId, decision }, { onSuccess: () => onDone({ dealerId, companyName, decision }), onError: (error) => summary.showServerError(error) });
    },
    () => decide.reset(),
  );

  return (
    <form noValidate onSubmit={onSubmit} aria-label={`Decline ${companyName}`} className="grid content-start gap-3 rounded-md border border-oxide/40 bg-white p-4">
      <h3 className="text-lg font-bold">Decline</h3>
      {summary.shown && <ErrorSummary variant="compact" {...summary.props} />}
      <TextAreaField id={id} label="Reason" hint="Sent to the applicant in the decision e-mail. Keep it short and factual." error={errors.reason?.message} rows={4} {...form.register('reason')} />
      <div>
        <button type="submit" className={buttonClass('secondary')} disabled={decide.isPending}>
          {decide.isPending ? 'Declining…' : `Decline ${companyName}`}
        </button>
      </div>
    </form>
  );
}
