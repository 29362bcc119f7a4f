import { feature } from 'topojson-client';
import statesUrl from 'us-atlas/states-10m.json?url';

// State outlines for orientation, from the us-atlas package bundled with the
// app (coarse at street zoom; no tile server involved).
let cache: Promise<GeoJSON.FeatureCollection> | null = null;

export function loadStates(): Promise<GeoJSON.FeatureCollection> {
  cache ??= fetch(statesUrl)
    .then((r) => r.json())
    .then((topo) => feature(topo, topo.objects.states) as unknown as GeoJSON.FeatureCollection);
  return cache;
}
