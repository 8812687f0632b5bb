export function FloorSlipRoute() {
  return <h1 className="text-2xl font-bold">Packing slip</h1>;
}
