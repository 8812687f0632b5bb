export function FitmentRoute() {
  return (
    <div className="py-8">
      <h1 className="text-2xl font-bold">Fitment check</h1>
      <p className="mt-2 text-cast">The fitment check is being set up.</p>
    </div>
  );
}
