import { lazy, Suspense, type ComponentProps } from 'react';

// MapLibre is a large chunk: the map screens load it only when shown.
const NetworkMap = lazy(() => import('./network-map').then((m) => ({ default: m.NetworkMap })));

export function LazyNetworkMap(props: ComponentProps<typeof NetworkMap>) {
  return (
    <Suspense
      fallback={
        <div
          className="flex items-center justify-center rounded border border-asphalt-line bg-white text-sm text-asphalt-muted"
          style={{ height: props.height ?? 520 }}
        >
          Loading the map…
        </div>
      }
    >
      <NetworkMap {...props} />
    </Suspense>
  );
}
