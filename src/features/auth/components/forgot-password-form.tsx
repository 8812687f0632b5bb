import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignInSchema } from '../../../../shared/schemas/accounts';
import { buttonClass } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { authErrorMessage } from '../auth-errors';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, TextField } from '../../../components/ui/form';

const ResetRequestSchema = SignInSchema.pick({ email: true });
const FIELDS = [{ name: 'email', id: 'forgot-email', label: 'E-mail address' }] as const;

export function ForgotPasswordForm({ inboxHint }: { inboxHint?: React.ReactNode }) {
  const form = useForm<{ email: string }>({ shouldFocusError: false, resolver: zodResolver(ResetRequestSchema), defaultValues: { email: '' } });
  const request = useRequestPasswordReset();
  const summary = useErrorSummary(form, FIELDS);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit(
    ({ email }) => {
      request.mutate(email, { onSuccess: () => setSentTo(email), onError: (error) => summary.showServerError(error, authErrorMessage(error, 'reset-request')) });
    },
    () => request.reset(),
  );

  if (sentTo) {
    return (
      <Notice tone="done" title="Check your e-mail">
        <p className="text-ink">
          If an account uses <span className="font-semibold break-all">{sentTo}</span>, a link to choose a new password is on its way. It works once, for
          one hour.
        </p>
        {inboxHint}
      </Notice>
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Ask for a password-reset link">
      {summary.shown && <ErrorSummary {...summary.props} />}
      <TextField
        id="forgot-email"
        label="E-mail address"
        type="email"
        autoComplete="email"
        hint="The address you signed up with. We send a link there."
        error={errors.email?.message}
        {...form.register('email')}
      />
      <div>
        <button type="submit" className={buttonClass('primary', 'lg')} disabled={request.isPending}>
          {request.isPending ? 'Sending…' : 'Send the link'}
        </button>
      </div>
    </form>
  );
}
