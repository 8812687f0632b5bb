import { useEffect, useRef, useState, type ReactNode } from 'react';

/** How far ahead of the screen a block starts to load: about a screen, so it is drawn before it is reached. */
const AHEAD = '800px 0px';

/**
 * Draws `children` once the place they will take comes near the screen, and holds that place (`minHeight`) until then.
 * For blocks below the fold whose code waits in a chunk of its own: a first visit does not download them unless the
 * visitor scrolls towards them (on a large screen that shows them at once, they load at once). Without
 * IntersectionObserver they are drawn straight away.
 */
export function NearView({ children, minHeight, label }: { children: ReactNode; minHeight: string; label: string }) {
  const place = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(() => typeof IntersectionObserver === 'undefined');
  useEffect(() => {
    if (near || !place.current) return;
    const observer = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) setNear(true);
    }, { rootMargin: AHEAD });
    observer.observe(place.current);
    return () => observer.disconnect();
  }, [near]);
  if (near) return <>{children}</>;
  return <div ref={place} style={{ minHeight }} role="region" aria-label={label} aria-busy="true" />;
}
