export function SignUpRoute() {
  return <h1 className="text-2xl font-bold">Create an account</h1>;
}
