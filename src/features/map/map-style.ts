import type { StyleSpecification } from 'maplibre-gl';
import latoUrl from '@fontsource/lato/files/lato-latin-700-normal.woff2?url';
import { CONDITION_BANDS, NO_DATA_COLOR } from '@shared/condition';

// Our own style, shipped with the app: no tile server, no glyph server. Labels
// are drawn in the browser from the Lato file bundled by Vite.
export const EMPTY_FC: GeoJSON.FeatureCollection = { type: 'FeatureCollection', features: [] };

/** PCI → band colour; p = -1 means no survey (or unpaved). */
export const pciColor = [
  'case',
  ['<', ['get', 'p'], 0],
  NO_DATA_COLOR,
  [
    'step',
    ['get', 'p'],
    ...CONDITION_BANDS.slice()
      .reverse()
      .flatMap((b, i) => (i === 0 ? [b.color] : [b.min, b.color])),
  ],
] as unknown as string;

/** Line width by functional class, growing with zoom. */
const classWidth = (scale: number) =>
  [
    'match',
    ['get', 'c'],
    ['interstate', 'freeway', 'principal_arterial'],
    3.2 * scale,
    'minor_arterial',
    2.6 * scale,
    ['major_collector', 'minor_collector'],
    2 * scale,
    1.3 * scale,
  ] as unknown;

export function networkStyle(): StyleSpecification {
  return {
    version: 8,
    'font-faces': { Lato: latoUrl },
    sources: {
      states: { type: 'geojson', data: EMPTY_FC as never },
      extent: { type: 'geojson', data: EMPTY_FC as never },
      segments: { type: 'geojson', data: EMPTY_FC as never, promoteId: 'id' },
      highlight: { type: 'geojson', data: EMPTY_FC as never },
    },
    layers: [
      { id: 'background', type: 'background', paint: { 'background-color': '#f1eee6' } },
      { id: 'states-line', type: 'line', source: 'states', paint: { 'line-color': '#b9b2a2', 'line-width': 1 } },
      { id: 'extent-fill', type: 'fill', source: 'extent', paint: { 'fill-color': '#ffffff', 'fill-opacity': 0.6 } },
      {
        id: 'extent-line',
        type: 'line',
        source: 'extent',
        paint: { 'line-color': '#8c8574', 'line-width': 1.2, 'line-dasharray': [3, 2] },
      },
      {
        id: 'segments-casing',
        type: 'line',
        source: 'segments',
        layout: { 'line-cap': 'round' },
        paint: {
          'line-color': '#1f2328',
          'line-opacity': ['case', ['boolean', ['feature-state', 'selected'], false], 0.9, 0],
          'line-width': ['interpolate', ['linear'], ['zoom'], 9, classWidth(1.6), 15, classWidth(5)] as never,
        },
      },
      {
        id: 'segments-line',
        type: 'line',
        source: 'segments',
        layout: { 'line-cap': 'round' },
        paint: {
          'line-color': pciColor as never,
          'line-width': ['interpolate', ['linear'], ['zoom'], 9, classWidth(0.8), 15, classWidth(3)] as never,
        },
      },
      {
        id: 'highlight-line',
        type: 'line',
        source: 'highlight',
        paint: { 'line-color': '#1f2328', 'line-width': 10, 'line-opacity': 0.3 },
      },
      {
        id: 'segments-label',
        type: 'symbol',
        source: 'segments',
        minzoom: 13.5,
        layout: {
          'symbol-placement': 'line',
          'text-field': ['get', 'r'],
          'text-font': ['Lato'],
          'text-size': 11,
          'symbol-spacing': 400,
        },
        paint: { 'text-color': '#1f2328', 'text-halo-color': '#f7f5f0', 'text-halo-width': 1.5 },
      },
    ],
  };
}
