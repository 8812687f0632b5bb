export function FloorPackRoute() {
  return <h1 className="text-2xl font-bold">Pack and dispatch</h1>;
}
