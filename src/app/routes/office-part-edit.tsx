export function OfficePartEditRoute() {
  return <h1 className="text-2xl font-bold">Edit part</h1>;
}
