import 'maplibre-gl/dist/maplibre-gl.css';
import { bbox as turfBbox, bboxPolygon, buffer as turfBuffer } from '@turf/turf';
import * as maplibregl from 'maplibre-gl';
import workerUrl from 'maplibre-gl/dist/maplibre-gl-worker.mjs?url';
import { useEffect, useMemo, useRef, useState } from 'react';
import MapView, { type MapRef, NavigationControl, Popup, ScaleControl } from 'react-map-gl/maplibre';
import { Link } from 'react-router-dom';
import { conditionBand } from '@shared/condition';
import { CLASS_LABELS } from '@/lib/format';
import type { SegmentFeatures } from '../api/get-segments-geojson';
import { loadStates } from '../context-layers';
import { EMPTY_FC, networkStyle, pciColor } from '../map-style';
import { yearColorMatch } from '../year-colors';
import { YearLegend } from './year-legend';
import { ConditionLegend } from './condition-legend';

maplibregl.setWorkerUrl(workerUrl);

type Props = {
  agencyId: string;
  features: SegmentFeatures | undefined;
  selected?: Set<number>;
  onSelect?: (ids: number[], mode: 'replace' | 'add') => void;
  highlight?: GeoJSON.Geometry | null;
  height?: number | string;
  compact?: boolean;
  /** Colour segments by the plan year of their work (index 0 = first year) instead of by condition. */
  plannedYear?: Map<number, number>;
  yearLabels?: string[];
};

type PopupInfo = { lng: number; lat: number; id: number; s: string; r: string; p: number; c: string };

export function NetworkMap({
  agencyId,
  features,
  selected,
  onSelect,
  highlight,
  height = 520,
  compact = false,
  plannedYear,
  yearLabels,
}: Props) {
  const ref = useRef<MapRef>(null);
  const [loaded, setLoaded] = useState(false);
  const [popup, setPopup] = useState<PopupInfo | null>(null);
  const [boxMode, setBoxMode] = useState(false);
  const [box, setBox] = useState<{ x0: number; y0: number; x1: number; y1: number } | null>(null);
  const fitted = useRef(false);
  // One style object for the life of the map. A new object on each render makes
  // react-map-gl call setStyle, whose diff puts the sources back to the style's
  // empty data: every road vanished on the first click or selection.
  const style = useMemo(() => networkStyle(), []);

  // Data into the style's sources; fit the view once to the agency's extent.
  useEffect(() => {
    const map = ref.current?.getMap();
    if (!map || !loaded || !features) return;
    (map.getSource('segments') as maplibregl.GeoJSONSource).setData(features);
    if (features.features.length > 0) {
      const b = turfBbox(features) as [number, number, number, number];
      const extent = turfBuffer(bboxPolygon(b), 0.4, { units: 'miles' });
      (map.getSource('extent') as maplibregl.GeoJSONSource).setData(extent ?? EMPTY_FC);
      if (!fitted.current) {
        fitted.current = true;
        map.fitBounds([b[0], b[1], b[2], b[3]], { padding: compact ? 20 : 40, duration: 0, maxZoom: 15 });
      }
    }
    map.getCanvas().dataset.features = String(features.features.length);
  }, [features, loaded, compact]);

  useEffect(() => {
    const map = ref.current?.getMap();
    if (!map || !loaded) return;
    (map.getSource('highlight') as maplibregl.GeoJSONSource).setData(
      highlight ? { type: 'Feature', properties: {}, geometry: highlight } : EMPTY_FC,
    );
    if (highlight && compact) {
      const b = turfBbox(highlight) as [number, number, number, number];
      map.fitBounds(b, { padding: 60, duration: 0, maxZoom: 15 });
      fitted.current = true;
    }
  }, [highlight, loaded, compact]);

  // Selection shows as feature state (a dark casing), not a second copy of the data.
  const shown = useRef<Set<number>>(new Set());
  useEffect(() => {
    const map = ref.current?.getMap();
    if (!map || !loaded || !features) return;
    for (const id of shown.current)
      if (!selected?.has(id)) map.setFeatureState({ source: 'segments', id }, { selected: false });
    for (const id of selected ?? []) map.setFeatureState({ source: 'segments', id }, { selected: true });
    shown.current = new Set(selected ?? []);
  }, [selected, loaded, features]);

  // Plan mode: planned year as feature state, and a paint that reads it.
  useEffect(() => {
    const map = ref.current?.getMap();
    if (!map || !loaded || !features) return;
    if (!plannedYear) {
      map.setPaintProperty('segments-line', 'line-color', pciColor as never);
      return;
    }
    for (const f of features.features)
      map.setFeatureState({ source: 'segments', id: f.properties.id }, { py: plannedYear.get(f.properties.id) ?? -1 });
    map.setPaintProperty('segments-line', 'line-color', yearColorMatch(yearLabels?.length ?? 0) as never);
  }, [plannedYear, yearLabels, loaded, features]);

  useEffect(() => {
    const map = ref.current?.getMap();
    if (!map || !loaded || compact) return;
    let cancelled = false;
    loadStates().then((fc) => {
      if (!cancelled) (map.getSource('states') as maplibregl.GeoJSONSource | undefined)?.setData(fc);
    });
    return () => {
      cancelled = true;
    };
  }, [loaded, compact]);

  const pick = (point: { x: number; y: number }) => {
    const map = ref.current?.getMap();
    if (!map) return [];
    // Clicks land on whole pixels: look in a small box around the point.
    const hits = map.queryRenderedFeatures(
      [
        [point.x - 3, point.y - 3],
        [point.x + 3, point.y + 3],
      ],
      { layers: ['segments-line'] },
    );
    return hits;
  };

  return (
    <div
      className={`relative overflow-hidden rounded border border-asphalt-line ${boxMode ? 'select-none' : ''}`}
      style={{ height }}
      data-testid="network-map"
    >
      <MapView
        ref={ref}
        mapLib={maplibregl}
        mapStyle={style}
        initialViewState={{ longitude: -98.5, latitude: 38.8, zoom: 8 }}
        attributionControl={false}
        dragPan={!boxMode}
        boxZoom={false}
        onLoad={(e) => {
          e.target.getCanvas().dataset.ready = '1';
          // Browser tests read rendered features through this handle on the map's element.
          (e.target.getContainer() as HTMLElement & { __map?: unknown }).__map = e.target;
          setLoaded(true);
        }}
        onIdle={(e) => {
          e.target.getCanvas().dataset.idle = String(Date.now());
        }}
        interactiveLayerIds={['segments-line']}
        cursor={boxMode ? 'crosshair' : undefined}
        onClick={(e) => {
          if (boxMode) return;
          const hit = pick(e.point)[0];
          if (!hit) {
            setPopup(null);
            return;
          }
          const p = hit.properties as unknown as PopupInfo;
          setPopup({ ...p, lng: e.lngLat.lng, lat: e.lngLat.lat });
          onSelect?.([Number(p.id)], e.originalEvent.shiftKey ? 'add' : 'replace');
        }}
        onMouseDown={(e) => {
          if (!boxMode) return;
          setBox({ x0: e.point.x, y0: e.point.y, x1: e.point.x, y1: e.point.y });
        }}
        onMouseMove={(e) => {
          if (box) setBox({ ...box, x1: e.point.x, y1: e.point.y });
        }}
        onMouseUp={(e) => {
          if (!box) return;
          const map = ref.current?.getMap();
          const hits = map?.queryRenderedFeatures(
            [
              [Math.min(box.x0, e.point.x), Math.min(box.y0, e.point.y)],
              [Math.max(box.x0, e.point.x), Math.max(box.y0, e.point.y)],
            ],
            { layers: ['segments-line'] },
          );
          // A feature comes back once per tile it crosses: dedupe by id.
          const ids = [...new Set((hits ?? []).map((h) => Number(h.properties?.id)))];
          setBox(null);
          setBoxMode(false);
          onSelect?.(ids, e.originalEvent.shiftKey ? 'add' : 'replace');
        }}
        style={{ width: '100%', height: '100%' }}
      >
        <NavigationControl position="top-right" showCompass={false} />
        <ScaleControl position="bottom-right" unit="imperial" />
        {popup && (
          <Popup
            longitude={popup.lng}
            latitude={popup.lat}
            onClose={() => setPopup(null)}
            closeOnClick={false}
            maxWidth="260px"
          >
            <div className="text-xs" data-testid="map-popup">
              <div className="font-bold">{popup.r}</div>
              <div className="text-asphalt-muted">
                {popup.s} · {CLASS_LABELS[popup.c] ?? popup.c}
              </div>
              <div className="mt-1">
                PCI <span className="num font-semibold">{popup.p < 0 ? '—' : popup.p}</span>
                {popup.p >= 0 && (
                  <span className="text-asphalt-muted"> ({conditionBand(popup.p)?.label.toLowerCase()})</span>
                )}
              </div>
              <Link
                to={`/a/${agencyId}/roads/${popup.id}`}
                className="mt-1 inline-block font-semibold text-accent hover:underline"
              >
                Open segment
              </Link>
            </div>
          </Popup>
        )}
      </MapView>
      {box && (
        <div
          className="pointer-events-none absolute border-2 border-accent bg-accent/10"
          style={{
            left: Math.min(box.x0, box.x1),
            top: Math.min(box.y0, box.y1),
            width: Math.abs(box.x1 - box.x0),
            height: Math.abs(box.y1 - box.y0),
          }}
        />
      )}
      {!compact && (
        <div className="absolute left-2 top-2 flex gap-2">
          {onSelect && (
            <button
              type="button"
              className={`rounded border px-2 py-1 text-xs font-semibold shadow-sm ${boxMode ? 'border-accent bg-accent text-white' : 'border-asphalt-line bg-white text-asphalt'}`}
              onClick={() => {
                // The popup would sit under the box and catch the drag.
                setPopup(null);
                setBoxMode(!boxMode);
              }}
            >
              {boxMode ? 'Drag a box on the map…' : 'Select by box'}
            </button>
          )}
        </div>
      )}
      {!compact && !plannedYear && <ConditionLegend />}
      {plannedYear && <YearLegend plannedYear={plannedYear} yearLabels={yearLabels ?? []} />}
    </div>
  );
}
