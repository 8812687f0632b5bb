export function ForgotPasswordRoute() {
  return <h1 className="text-2xl font-bold">Forgot your password</h1>;
}
