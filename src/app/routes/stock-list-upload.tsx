export function StockListUploadRoute() {
  return <h1 className="text-2xl font-bold">Upload a stock list</h1>;
}
