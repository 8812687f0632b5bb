export function SavedFitmentsRoute() {
  return <h1 className="text-2xl font-bold">Saved fitment checks</h1>;
}
