export function OfficeDealersRoute() {
  return <h1 className="text-2xl font-bold">Dealer accounts</h1>;
}
