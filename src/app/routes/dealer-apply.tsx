export function DealerApplyRoute() {
  return <h1 className="text-2xl font-bold">Apply for a trade account</h1>;
}
