export function OrderRoute() {
  return <h1 className="text-2xl font-bold">Order</h1>;
}
