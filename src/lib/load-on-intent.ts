/**
 * A piece of the page whose code loads only when the visitor shows they mean to use it (pointer over it, touched or
 * focused). The code is asked for once and kept for every later page; a failed load (say, the connection dropped) is
 * tried again on the next sign of intent, while the stand-in keeps working.
 */
export function loadOnIntent<T>(importer: () => Promise<T>) {
  let loaded: T | null = null;
  let loading: Promise<T> | null = null;
  return {
    /** What has arrived so far, if anything (for a component's first state). */
    loaded: () => loaded,
    load(): Promise<T> {
      loading ??= importer().then(
        (value) => (loaded = value),
        (err: unknown) => {
          loading = null;
          throw err;
        },
      );
      return loading;
    },
  };
}
