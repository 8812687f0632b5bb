export function OrdersRoute() {
  return <h1 className="text-2xl font-bold">Your orders</h1>;
}
