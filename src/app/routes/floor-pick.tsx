export function FloorPickRoute() {
  return <h1 className="text-2xl font-bold">Pick list</h1>;
}
