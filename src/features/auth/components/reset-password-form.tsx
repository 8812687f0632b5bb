import { zodResolver } from '@hookform/resolvers/zod';
import { useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { PASSWORD_MIN, SignUpSchema } from '../../../../shared/schemas/accounts';
import { buttonClass } from '../../../components/ui/button';
import { useResetPassword } from '../api/reset-password';
import { authErrorMessage } from '../auth-errors';
import { ErrorSummary, summaryItems, TextField } from '../../../components/ui/form';

const NewPasswordSchema = z
  .object({ password: SignUpSchema.shape.password, confirm: z.string().min(1, 'type the new password again') })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'the two passwords are not the same' });
type NewPassword = z.infer<typeof NewPasswordSchema>;

const FIELDS = [
  { name: 'password', id: 'reset-password', label: 'New password' },
  { name: 'confirm', id: 'reset-confirm', label: 'New password again' },
] as const;

export function ResetPasswordForm({ token, onDone, expiredHelp }: { token: string; onDone: () => void; expiredHelp: React.ReactNode }) {
  const form = useForm<NewPassword>({ shouldFocusError: false, resolver: zodResolver(NewPasswordSchema), defaultValues: { password: '', confirm: '' } });
  const reset = useResetPassword();
  const summaryRef = useRef<HTMLDivElement>(null);
  const [showSummary, setShowSummary] = useState(false);
  const errors = form.formState.errors;
  const focusSummary = () => requestAnimationFrame(() => summaryRef.current?.focus());

  const onSubmit = form.handleSubmit(
    ({ password }) => {
      setShowSummary(false);
      reset.mutate(
        { token, newPassword: password },
        {
          onSuccess: onDone,
          onError: () => {
            setShowSummary(true);
            focusSummary();
          },
        },
      );
    },
    () => {
      reset.reset();
      setShowSummary(true);
      focusSummary();
    },
  );

  const formError = reset.isError ? (
    <>
      <p>{authErrorMessage(reset.error, 'reset')}</p>
      {expiredHelp}
    </>
  ) : undefined;
  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Choose a new password">
      {showSummary && <ErrorSummary ref={summaryRef} items={summaryItems(errors, FIELDS)} formError={formError} />}
      <TextField
        id="reset-password"
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <TextField id="reset-confirm" label="New password again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...form.register('confirm')} />
      <div>
        <button type="submit" className={buttonClass('primary', 'lg')} disabled={reset.isPending}>
          {reset.isPending ? 'Saving…' : 'Save the new password'}
        </button>
      </div>
    </form>
  );
}
