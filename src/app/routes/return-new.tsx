export function ReturnNewRoute() {
  return <h1 className="text-2xl font-bold">Return a part</h1>;
}
