import { zodResolver } from '@hookform/resolvers/zod';
import { useRef } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { SignInSchema, type Me, type SignIn } from '../../../../shared/schemas/accounts';
import { Button, buttonClass } from '../../../components/ui/button';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { useSignIn } from '../api/sign-in';
import { authErrorMessage } from '../auth-errors';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, TextField } from '../../../components/ui/form';

const FIELDS = [
  { name: 'email', id: 'sign-in-email', label: 'E-mail address' },
  { name: 'password', id: 'sign-in-password', label: 'Password' },
] as const;

export function SignInForm({ demoAccounts, onSignedIn }: { demoAccounts?: Me['demoAccounts']; onSignedIn: () => void }) {
  const form = useForm<SignIn>({ shouldFocusError: false, resolver: zodResolver(SignInSchema), defaultValues: { email: '', password: '' } });
  const signIn = useSignIn();
  const submitRef = useRef<HTMLButtonElement>(null);
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit(
    (values) => {
      signIn.mutate(values, {
        onSuccess: onSignedIn,
        onError: (error) => {
          form.setValue('password', '');
          summary.showServerError(error, authErrorMessage(error, 'sign-in'));
        },
      });
    },
    () => signIn.reset(),
  );

  const fillAccount = (email: string, password: string) => {
    form.reset({ email, password });
    summary.hide();
    signIn.reset();
    submitRef.current?.focus();
  };

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-8">
      <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Sign in">
        {summary.shown && <ErrorSummary {...summary.props} />}
        <TextField
          id="sign-in-email"
          label="E-mail address"
          type="email"
          autoComplete="username"
          error={errors.email?.message}
          {...form.register('email')}
        />
        <TextField
          id="sign-in-password"
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          hint={
            <Link to="/forgot-password" className="font-semibold text-temper underline underline-offset-2">
              Forgot your password?
            </Link>
          }
          {...form.register('password')}
        />
        <div className="flex flex-wrap items-center gap-4">
          <button ref={submitRef} type="submit" className={buttonClass('primary', 'lg')} disabled={signIn.isPending}>
            {signIn.isPending ? 'Signing in…' : 'Sign in'}
          </button>
          <p className="text-cast">
            New here?{' '}
            <Link to="/sign-up" className="font-semibold text-temper underline underline-offset-2">
              Create an account
            </Link>
          </p>
        </div>
      </form>
      {demoAccounts && demoAccounts.length > 0 && <DemoAccounts accounts={demoAccounts} onUse={fillAccount} />}
    </div>
  );
}

function DemoAccounts({ accounts, onUse }: { accounts: NonNullable<Me['demoAccounts']>; onUse: (email: string, password: string) => void }) {
  return (
    <section aria-labelledby="demo-accounts-heading" className="rounded-md border border-dashed border-amber-line bg-amber-tint/60 p-4">
      <h2 id="demo-accounts-heading" className="text-lg font-bold">
        Demo accounts <span className="rounded bg-white px-2 py-0.5 text-sm font-semibold uppercase tracking-wider text-amber">development only</span>
      </h2>
      <p className="text-sm text-cast">One account per role, shown here because this server runs in development. Production never lists them.</p>
      <TableFrame className="mt-3">
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">Demo accounts with their passwords</caption>
          <thead className="bg-panel">
            <tr>
              <Th>Role</Th>
              <Th>E-mail</Th>
              <Th>Password</Th>
              <Th>
                <span className="sr-only">Action</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {accounts.map((a) => (
              <tr key={a.email} className="border-t border-cast-line first:border-t-0">
                <Td className="whitespace-nowrap font-semibold">{a.role}</Td>
                <Td className="whitespace-nowrap">{a.email}</Td>
                <Td className="whitespace-nowrap font-mono">{a.password}</Td>
                <Td className="text-right">
                  <Button variant="secondary" className="min-h-9" onClick={() => onUse(a.email, a.password)} aria-label={`Use ${a.email}`}>
                    Use
                  </Button>
                </Td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableFrame>
    </section>
  );
}
