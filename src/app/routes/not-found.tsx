import { Link } from 'react-router-dom';

export function NotFoundRoute() {
  return (
    <div className="py-10">
      <h1 className="text-2xl font-bold">No such page</h1>
      <p className="mt-2 text-cast">The address may be mistyped, or the page has moved.</p>
      <Link to="/catalogue" className="mt-3 inline-block font-semibold text-temper underline">
        Search the catalogue
      </Link>
    </div>
  );
}
