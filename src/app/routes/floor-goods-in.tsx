export function FloorGoodsInRoute() {
  return <h1 className="text-2xl font-bold">Goods in</h1>;
}
