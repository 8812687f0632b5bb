export function ReturnsRoute() {
  return <h1 className="text-2xl font-bold">Your returns</h1>;
}
