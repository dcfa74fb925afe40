/**
 * Server-safe shells of the plots: on the server and until the page has mounted they render a visible
 * loading box (role="status"); after mount they load plots.client.tsx (and with it Plotly) with a lazy
 * import inside Suspense. A failed chunk load shows a message instead of breaking the page.
 */
import {
  Component,
  lazy,
  Suspense,
  useSyncExternalStore,
  type ReactNode,
} from "react";
import { SLICES_HEIGHT, surfaceHeight } from "./size";
import type { PropertySlicesProps, PropertySurfaceProps } from "./types";

let loading: Promise<typeof import("./plots.client")> | null = null;

/** Starts loading the Plotly chunk (once); the lazy components reuse the same promise. */
export function preloadPlots() {
  loading ??= import("./plots.client").catch((error: unknown) => {
    loading = null;
    throw error;
  });
  return loading;
}

const LazySurface = lazy(() =>
  preloadPlots().then((m) => ({ default: m.SurfaceFigure })),
);
const LazySlices = lazy(() =>
  preloadPlots().then((m) => ({ default: m.SlicesFigure })),
);

const noSubscription = () => () => {};

/** False while rendering on the server and hydrating, true once mounted in the browser. */
function useMounted() {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}

export function PlotPlaceholder({
  text,
  height,
  className = "",
}: {
  text: string;
  height: number;
  className?: string;
}) {
  return (
    <div
      role="status"
      aria-live="polite"
      className={`flex items-center justify-center rounded border border-dashed border-line bg-panel text-sm text-ink-muted ${className}`}
      style={{ height }}
    >
      <span className="flex items-center gap-2">
        <span
          aria-hidden="true"
          className="inline-block h-3 w-3 animate-pulse rounded-full bg-accent/60"
        />
        {text}
      </span>
    </div>
  );
}

class PlotErrorBoundary extends Component<
  { height: number; children: ReactNode },
  { failed: boolean }
> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  render() {
    if (!this.state.failed) return this.props.children;
    return (
      <div
        role="alert"
        className="flex items-center justify-center rounded border border-line bg-panel p-6 text-sm text-danger"
        style={{ height: this.props.height }}
      >
        The plotting code could not be loaded. Check the connection and reload
        the page; the numbers above do not depend on it.
      </div>
    );
  }
}

function surfaceHeightOf(props: PropertySurfaceProps) {
  return (
    props.height ??
    surfaceHeight(
      props.series.length,
      props.series.length > 1
        ? (props.arrangement ?? "overlaid")
        : "side-by-side",
    )
  );
}

/** 3D surface of one property for one or several samples (see README.md). */
export function PropertySurface(props: PropertySurfaceProps) {
  const mounted = useMounted();
  const height = surfaceHeightOf(props);
  const placeholder = (
    <PlotPlaceholder
      text="Loading the 3D surface…"
      height={height}
      className={props.className}
    />
  );
  if (!mounted) return placeholder;
  return (
    <PlotErrorBoundary height={height}>
      <Suspense fallback={placeholder}>
        <LazySurface {...props} />
      </Suspense>
    </PlotErrorBoundary>
  );
}

/** Property against pressure at chosen temperatures (see README.md). */
export function PropertySlices(props: PropertySlicesProps) {
  const mounted = useMounted();
  const height = props.height ?? SLICES_HEIGHT;
  const placeholder = (
    <PlotPlaceholder
      text="Loading the pressure slices…"
      height={height}
      className={props.className}
    />
  );
  if (!mounted) return placeholder;
  return (
    <PlotErrorBoundary height={height}>
      <Suspense fallback={placeholder}>
        <LazySlices {...props} />
      </Suspense>
    </PlotErrorBoundary>
  );
}
