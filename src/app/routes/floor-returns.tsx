export function FloorReturnsRoute() {
  return <h1 className="text-2xl font-bold">Returns and cores</h1>;
}
