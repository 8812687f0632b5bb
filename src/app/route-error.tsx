import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';

export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <main className="mx-auto max-w-3xl px-4 py-12">
      <h1 className="text-2xl font-bold">This page ran into a problem</h1>
      <p className="mt-2 text-cast">Nothing you entered was lost on our side. Reload the page, or go back to the counter.</p>
      <p className="mt-2 font-mono text-sm text-cast">{message}</p>
      <Link to="/" className="mt-4 inline-block font-semibold text-temper underline">
        Back to the counter
      </Link>
    </main>
  );
}
