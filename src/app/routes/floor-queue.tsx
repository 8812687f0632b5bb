export function FloorQueueRoute() {
  return <h1 className="text-2xl font-bold">Pick queue</h1>;
}
