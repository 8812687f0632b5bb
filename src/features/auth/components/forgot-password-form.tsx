import { zodResolver } from '@hookform/resolvers/zod';
import { MailCheck } from 'lucide-react';
import { useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignInSchema } from '../../../../shared/schemas/accounts';
import { buttonClass } from '../../../components/ui/button';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { authErrorMessage } from '../auth-errors';
import { ErrorSummary, summaryItems, TextField } from '../../../components/ui/form';

const ResetRequestSchema = SignInSchema.pick({ email: true });
const FIELDS = [{ name: 'email', id: 'forgot-email', label: 'E-mail address' }] as const;

export function ForgotPasswordForm({ inboxHint }: { inboxHint?: React.ReactNode }) {
  const form = useForm<{ email: string }>({ shouldFocusError: false, resolver: zodResolver(ResetRequestSchema), defaultValues: { email: '' } });
  const request = useRequestPasswordReset();
  const summaryRef = useRef<HTMLDivElement>(null);
  const [showSummary, setShowSummary] = useState(false);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const errors = form.formState.errors;
  const focusSummary = () => requestAnimationFrame(() => summaryRef.current?.focus());

  const onSubmit = form.handleSubmit(
    ({ email }) => {
      setShowSummary(false);
      request.mutate(email, {
        onSuccess: () => setSentTo(email),
        onError: () => {
          setShowSummary(true);
          focusSummary();
        },
      });
    },
    () => {
      request.reset();
      setShowSummary(true);
      focusSummary();
    },
  );

  if (sentTo) {
    return (
      <div role="status" className="flex gap-3 rounded-md border border-machined bg-machined-tint p-4">
        <MailCheck aria-hidden className="mt-0.5 size-5 shrink-0 text-machined" />
        <div>
          <p className="font-semibold">Check your e-mail</p>
          <p>
            If an account uses <span className="font-semibold break-all">{sentTo}</span>, a link to choose a new password is on its way. It works once, for
            one hour.
          </p>
          {inboxHint}
        </div>
      </div>
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Ask for a password-reset link">
      {showSummary && <ErrorSummary ref={summaryRef} items={summaryItems(errors, FIELDS)} formError={request.isError ? authErrorMessage(request.error, 'reset-request') : undefined} />}
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
