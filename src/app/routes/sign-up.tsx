import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { authKeys } from '../../features/auth/api/keys';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { safeNextPath, signInHref } from '../../features/auth/next-path';
import { cartKeys } from '../../features/cart/api/keys';

export function SignUpRoute() {
  const [params] = useSearchParams();
  const nextParam = params.get('next');
  const next = safeNextPath(nextParam, '/account');
  const navigate = useNavigate();
  const client = useQueryClient();

  // A new account is signed in straight away; a guest cart joins it like at sign-in.
  const onSignedUp = async () => {
    await Promise.all([client.invalidateQueries({ queryKey: authKeys.all }), client.invalidateQueries({ queryKey: cartKeys.all })]);
    navigate(next, { replace: true, state: { welcome: true } });
  };

  return (
    <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
      <div>
        <h1 className="text-3xl font-bold">Create an account</h1>
        <p className="mt-1 text-cast">
          A retail account keeps your orders and saved fitment checks. Workshops and resellers can apply for a trade account once signed in.
        </p>
      </div>
      <SignUpForm onSignedUp={() => void onSignedUp()} signInHref={nextParam ? signInHref(next) : '/sign-in'} />
    </div>
  );
}
