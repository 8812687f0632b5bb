export function AccountRoute() {
  return <h1 className="text-2xl font-bold">Your account</h1>;
}
