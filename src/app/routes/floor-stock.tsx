export function FloorStockRoute() {
  return <h1 className="text-2xl font-bold">Stock</h1>;
}
