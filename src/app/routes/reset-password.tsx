export function ResetPasswordRoute() {
  return <h1 className="text-2xl font-bold">Choose a new password</h1>;
}
