export function OfficePriceImportsRoute() {
  return <h1 className="text-2xl font-bold">Price list import</h1>;
}
