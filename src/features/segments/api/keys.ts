// Every segment query key, from general to specific. Everything under `all` shows
// segments (lists, pages, the map, details, districts, treatment records), so a
// write to a segment or its history invalidates `all` (and the network summary).
import type { SegmentFilters } from './get-segments';

export const segmentKeys = {
  all: (agencyId: string) => ['segments', agencyId] as const,
  list: (agencyId: string, f: SegmentFilters) => [...segmentKeys.all(agencyId), 'list', f] as const,
  pages: (agencyId: string, f: SegmentFilters) => [...segmentKeys.all(agencyId), 'pages', f] as const,
  detail: (agencyId: string, id: number) => [...segmentKeys.all(agencyId), 'detail', id] as const,
  treatments: (agencyId: string, id: number) => [...segmentKeys.all(agencyId), 'treatments', id] as const,
  districts: (agencyId: string) => [...segmentKeys.all(agencyId), 'districts'] as const,
  map: (agencyId: string, filters: Record<string, string | undefined>) =>
    [...segmentKeys.all(agencyId), 'geojson', filters] as const,
};
