export function CartRoute() {
  return <h1 className="text-2xl font-bold">Your cart</h1>;
}
