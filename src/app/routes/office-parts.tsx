export function OfficePartsRoute() {
  return <h1 className="text-2xl font-bold">Catalogue upkeep</h1>;
}
