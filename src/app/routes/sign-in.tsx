export function SignInRoute() {
  return <h1 className="text-2xl font-bold">Sign in</h1>;
}
