export function CheckoutRoute() {
  return <h1 className="text-2xl font-bold">Checkout</h1>;
}
