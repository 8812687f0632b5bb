import { Component, Suspense, type ReactNode } from 'react';
import { Outlet, useLocation } from 'react-router-dom';
import { RouteError } from './route-error';
import { LoadingState } from '../components/ui/states';

/** Holds the page's place (the footer stays below the fold) while its code arrives on a first visit. */
const pageFallback = (
  <div className="min-h-screen">
    <LoadingState label="Loading the page…" />
  </div>
);

interface ErrorScreenProps {
  locationKey: string;
  children: ReactNode;
}
interface ErrorScreenState {
  /** Boxed, so that even a thrown `undefined` counts. */
  error: { value: unknown } | null;
  locationKey: string;
}

/** What went wrong in a page (or the layout), in place of it; cleared when the address changes. */
export class ErrorScreen extends Component<ErrorScreenProps, ErrorScreenState> {
  override state: ErrorScreenState = { error: null, locationKey: this.props.locationKey };
  static getDerivedStateFromError(error: unknown): Partial<ErrorScreenState> {
    return { error: { value: error } };
  }
  static getDerivedStateFromProps(props: ErrorScreenProps, state: ErrorScreenState): Partial<ErrorScreenState> | null {
    return props.locationKey === state.locationKey ? null : { error: null, locationKey: props.locationKey };
  }
  override render() {
    return this.state.error ? <RouteError error={this.state.error.value} /> : this.props.children;
  }
}

/**
 * The page inside the layout. The Suspense boundary stays mounted across navigations, and navigations render in a
 * transition, so the page on screen stays until the next one's code is here (the header's loading bar shows meanwhile);
 * only a first visit shows the placeholder.
 */
export function PageOutlet() {
  const location = useLocation();
  return (
    <ErrorScreen locationKey={location.key}>
      <Suspense fallback={pageFallback}>
        <Outlet />
      </Suspense>
    </ErrorScreen>
  );
}

