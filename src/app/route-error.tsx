import { Link } from 'react-router-dom';

/** A page (or the layout) that failed to draw or to download; the rest of the app carries on. */
export function RouteError({ error }: { error: unknown }) {
  const message = error instanceof Error ? error.message : 'Unknown error';
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
