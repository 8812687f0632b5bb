import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { PASSWORD_MIN } from '../../../../shared/schemas/accounts';
import { SignUpSchema } from '../../../../shared/schemas/sign-up';
import { buttonClass } from '../../../components/ui/button';
import { useResetPassword } from '../api/reset-password';
import { authErrorMessage } from '../auth-errors';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, TextField } from '../../../components/ui/form';

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
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit(
    ({ password }) => {
      reset.mutate(
        { token, newPassword: password },
        {
          onSuccess: onDone,
          onError: (error) =>
            summary.showServerError(
              error,
              <>
                <p>{authErrorMessage(error, 'reset')}</p>
                {expiredHelp}
              </>,
            ),
        },
      );
    },
    () => reset.reset(),
  );

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Choose a new password">
      {summary.shown && <ErrorSummary {...summary.props} />}
      <TextField
        id="reset-password"
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters, and not a common password.`}
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
