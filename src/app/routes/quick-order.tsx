export function QuickOrderRoute() {
  return <h1 className="text-2xl font-bold">Quick order</h1>;
}
