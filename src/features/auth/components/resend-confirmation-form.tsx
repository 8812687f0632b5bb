import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignInSchema } from '../../../../shared/schemas/accounts';
import { buttonClass } from '../../../components/ui/button';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, TextField } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/notice';
import { useSendConfirmation } from '../api/send-confirmation';

const AddressSchema = SignInSchema.pick({ email: true });
const FIELDS = [{ name: 'email', id: 'resend-email', label: 'E-mail address' }] as const;

/** Asks for a fresh confirmation link; the new link brings the buyer back to `next`. */
export function ResendConfirmationForm({ next }: { next: string }) {
  const form = useForm<{ email: string }>({ shouldFocusError: false, resolver: zodResolver(AddressSchema), defaultValues: { email: '' } });
  const send = useSendConfirmation();
  const summary = useErrorSummary(form, FIELDS);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit(
    ({ email }) => {
      send.mutate(
        { email, next },
        {
          onSuccess: () => {
            setSentTo(email);
            form.reset();
          },
          onError: (error) => summary.showServerError(error),
        },
      );
    },
    () => send.reset(),
  );

  return (
    <div className="grid gap-4">
      {sentTo && (
        <Notice tone="done" title="Check your e-mail">
          If <span className="font-semibold break-all">{sentTo}</span> has an account waiting for confirmation, a new link is on its way. Use the newest
          message; it works for 24 hours.
        </Notice>
      )}
      <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Send a new confirmation link">
        {summary.shown && <ErrorSummary {...summary.props} />}
        <TextField
          id="resend-email"
          label="E-mail address"
          type="email"
          autoComplete="email"
          hint="The address you signed up with."
          error={errors.email?.message}
          {...form.register('email')}
        />
        <div>
          <button type="submit" className={buttonClass('primary', 'lg')} disabled={send.isPending}>
            {send.isPending ? 'Sending…' : 'Send a new link'}
          </button>
        </div>
      </form>
    </div>
  );
}
