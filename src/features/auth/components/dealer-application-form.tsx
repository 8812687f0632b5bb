import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { DealerApplicationSchema, type DealerApplication } from '../../../../shared/schemas/accounts';
import { DELIVERY_ZONES } from '../../../../shared/pricing';
import { buttonClass } from '../../../components/ui/button';
import { useApplyForTradeAccount } from '../api/apply-for-trade-account';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextField } from '../../../components/ui/form';

const FIELDS = [
  { name: 'companyName', id: 'apply-company', label: 'Company name' },
  { name: 'contactName', id: 'apply-contact', label: 'Contact name' },
  { name: 'phone', id: 'apply-phone', label: 'Phone' },
  { name: 'taxNumber', id: 'apply-tax', label: 'Tax number' },
  { name: 'addressLine1', id: 'apply-address', label: 'Street address' },
  { name: 'city', id: 'apply-city', label: 'Town or city' },
  { name: 'postcode', id: 'apply-postcode', label: 'Postcode' },
  { name: 'deliveryZone', id: 'apply-zone', label: 'Delivery zone' },
] as const;

export function DealerApplicationForm({ contactName, onApplied }: { contactName: string; onApplied: () => void }) {
  const form = useForm<DealerApplication>({
    shouldFocusError: false,
    resolver: zodResolver(DealerApplicationSchema),
    defaultValues: { companyName: '', contactName, phone: '', taxNumber: '', addressLine1: '', city: '', postcode: '' },
  });
  const apply = useApplyForTradeAccount();
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit(
    (values) => {
      // The server checks with the same schema; its field messages go beside the fields too.
      apply.mutate({ ...values, taxNumber: values.taxNumber || undefined }, { onSuccess: onApplied, onError: (error) => summary.showServerError(error) });
    },
    () => apply.reset(),
  );

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-5" aria-label="Trade account application">
      {summary.shown && <ErrorSummary {...summary.props} />}
      <fieldset className="grid gap-4 rounded-md border border-cast-line bg-white p-4">
        <legend className="px-1 text-lg font-bold">The business</legend>
        <TextField id="apply-company" label="Company name" autoComplete="organization" error={errors.companyName?.message} {...form.register('companyName')} />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField id="apply-contact" label="Contact name" autoComplete="name" error={errors.contactName?.message} {...form.register('contactName')} />
          <TextField id="apply-phone" label="Phone" type="tel" autoComplete="tel" hint="Digits, spaces and dashes; start with + for an international number." error={errors.phone?.message} {...form.register('phone')} />
        </div>
        <TextField id="apply-tax" label="Tax number" optional hint="If the business is registered for sales tax." error={errors.taxNumber?.message} className="sm:max-w-xs" {...form.register('taxNumber')} />
      </fieldset>
      <fieldset className="grid gap-4 rounded-md border border-cast-line bg-white p-4">
        <legend className="px-1 text-lg font-bold">Delivery address</legend>
        <TextField id="apply-address" label="Street address" autoComplete="address-line1" error={errors.addressLine1?.message} {...form.register('addressLine1')} />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField id="apply-city" label="Town or city" autoComplete="address-level2" error={errors.city?.message} {...form.register('city')} />
          <TextField id="apply-postcode" label="Postcode" autoComplete="postal-code" error={errors.postcode?.message} className="sm:max-w-48" {...form.register('postcode')} />
        </div>
        <SelectField id="apply-zone" label="Delivery zone" hint="Sets the freight rate on your orders." error={errors.deliveryZone?.message} defaultValue="" {...form.register('deliveryZone')}>
          <option value="" disabled>
            Choose a zone
          </option>
          {Object.entries(DELIVERY_ZONES).map(([key, label]) => (
            <option key={key} value={key}>
              {label}
            </option>
          ))}
        </SelectField>
      </fieldset>
      <div>
        <button type="submit" className={buttonClass('primary', 'lg')} disabled={apply.isPending}>
          {apply.isPending ? 'Sending…' : 'Send the application'}
        </button>
      </div>
    </form>
  );
}
