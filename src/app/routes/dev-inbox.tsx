export function DevInboxRoute() {
  return <h1 className="text-2xl font-bold">Development inbox</h1>;
}
