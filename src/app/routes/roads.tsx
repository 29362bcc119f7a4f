import { useMemo, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { CONDITION_BANDS } from '@shared/condition';
import { FUNCTIONAL_CLASSES, SURFACES } from '@shared/schemas/segments';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { EmptyState, PageHeader } from '@/components/ui/page';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { LazyNetworkMap } from '@/features/map/components/lazy-network-map';
import { useDistricts } from '@/features/segments/api/get-districts';
import { useSegments } from '@/features/segments/api/get-segments';
import { FilterSelect } from '@/features/segments/components/filter-select';
import { SegmentTable } from '@/features/segments/components/segment-table';
import { CLASS_LABELS, fmt1, fmtInt, SURFACE_LABELS } from '@/lib/format';
import { useAgency } from '../use-agency';

import { describeFilters, FILTER_KEYS, type Filters } from '@/features/segments/lib/filters';

export function RoadsPage() {
  const { agencyId, membership } = useAgency();
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const filters = useMemo(
    () => Object.fromEntries(FILTER_KEYS.map((k) => [k, params.get(k) ?? undefined])) as Filters,
    [params],
  );
  const [sort, setSort] = useState({ id: 'segmentId', desc: false });
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const summary = useSegments(agencyId, { ...filters, limit: 1 });
  const geo = useSegmentsGeoJson(agencyId, filters);
  const districts = useDistricts(agencyId);
  const canEdit = membership?.role === 'admin' || membership?.role === 'engineer';
  const t = summary.data?.totals;
  const filtered = FILTER_KEYS.some((k) => filters[k]);

  const setFilter = (k: string, v: string) => {
    const next = new URLSearchParams(params);
    if (v) next.set(k, v);
    else next.delete(k);
    setParams(next, { replace: true });
  };
  const clearFilters = () => setParams(new URLSearchParams(), { replace: true });
  const exportHref = (format: 'csv' | 'xlsx') => {
    const q = new URLSearchParams({ format });
    for (const [k, v] of Object.entries(filters)) if (v) q.set(k, v);
    return `/api/agencies/${agencyId}/segments/export?${q}`;
  };
  const toggle = (id: number) => {
    const next = new Set(selected);
    if (next.has(id)) next.delete(id);
    else next.add(id);
    setSelected(next);
  };
  // A district in the address that the list does not offer (typed by hand, or gone) still shows as chosen.
  const districtNames = districts.data?.items.map((d) => d.name) ?? [];
  const districtKnown =
    !filters.district || districtNames.some((n) => n.toLowerCase() === filters.district?.toLowerCase());

  return (
    <div>
      <PageHeader
        title="Roads"
        caption={
          !t
            ? 'Loading…'
            : t.count === 0 && filtered
              ? 'No segment matches the filters.'
              : `${fmtInt(t.count)} segments${filtered ? ' match' : ''} · ${fmt1(t.miles)} mi · ${fmt1(t.laneMiles)} lane-mi · ${fmtInt(t.areaSy)} SY · PCI ${fmt1(t.weightedPci)} (length-weighted)`
        }
        actions={
          <>
            <a
              className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold hover:border-asphalt-muted"
              href={exportHref('csv')}
            >
              Export CSV
            </a>
            <a
              className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold hover:border-asphalt-muted"
              href={exportHref('xlsx')}
            >
              Export XLSX
            </a>
          </>
        }
      />
      <div className="mb-2 flex flex-wrap items-center gap-2" data-testid="filter-bar">
        <TextInput
          aria-label="Road name or segment id"
          placeholder="Road name or segment id"
          className="max-w-[14rem]"
          value={filters.q ?? ''}
          onChange={(e) => setFilter('q', e.target.value)}
        />
        <FilterSelect
          label="Functional class"
          className="max-w-[11rem]"
          value={filters.class}
          onChange={(v) => setFilter('class', v)}
          all="All classes"
          choices={FUNCTIONAL_CLASSES.map((c) => [c, CLASS_LABELS[c]] as const)}
        />
        <FilterSelect
          label="Surface"
          className="max-w-[9rem]"
          value={filters.surface}
          onChange={(v) => setFilter('surface', v)}
          all="All surfaces"
          choices={SURFACES.map((c) => [c, SURFACE_LABELS[c]] as const)}
        />
        <FilterSelect
          label="Condition band"
          className="max-w-[11rem]"
          value={filters.band}
          onChange={(v) => setFilter('band', v)}
          all="All conditions"
          choices={CONDITION_BANDS.map((b) => [b.id, `${b.label} (PCI ${b.min}–${b.max})`] as const)}
        >
          <option value="none">No PCI</option>
        </FilterSelect>
        <FilterSelect
          label="District"
          className="max-w-[12rem]"
          value={
            districtKnown
              ? (districtNames.find((n) => n.toLowerCase() === filters.district?.toLowerCase()) ?? '')
              : filters.district
          }
          onChange={(v) => setFilter('district', v)}
          all="All districts"
          choices={(districts.data?.items ?? []).map((d) => [d.name, `${d.name} (${fmtInt(d.segments)})`] as const)}
        >
          {!districtKnown && <option value={filters.district}>{filters.district}</option>}
        </FilterSelect>
      </div>
      <div className="mb-3 flex flex-wrap items-center justify-end gap-2 text-sm">
        {filtered && (
          <Button variant="secondary" onClick={clearFilters}>
            Clear filters
          </Button>
        )}
        <span className="mr-auto text-xs text-asphalt-muted">
          Tick rows, click a road on the map (shift-click adds), or draw a box on the map to select.
        </span>
        <span className="num text-asphalt-muted" data-testid="selection-count">
          {selected.size} selected
        </span>
        {selected.size > 0 && (
          <Button variant="ghost" onClick={() => setSelected(new Set())}>
            Clear
          </Button>
        )}
        {canEdit && (
          <Button
            disabled={selected.size === 0}
            onClick={() => navigate(`../compare?segments=${[...selected].join(',')}`)}
          >
            Compare alternatives for selection
          </Button>
        )}
      </div>
      {t && t.count === 0 && !filtered ? (
        <EmptyState>No segments yet — import a spreadsheet or GIS file under Imports.</EmptyState>
      ) : (
        <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] 2xl:grid-cols-[minmax(0,7fr)_minmax(0,4fr)]">
          <SegmentTable
            agencyId={agencyId}
            filters={filters}
            sort={sort}
            onSort={setSort}
            canEdit={canEdit}
            selected={selected}
            onToggle={toggle}
            emptyFiltered={{ text: describeFilters(filters), onClear: clearFilters }}
          />
          <LazyNetworkMap
            agencyId={agencyId}
            features={geo.data}
            selected={selected}
            height={557}
            onSelect={(ids, mode) => setSelected(mode === 'add' ? new Set([...selected, ...ids]) : new Set(ids))}
          />
        </div>
      )}
      {canEdit && (
        <p className="mt-2 text-xs text-asphalt-muted">
          Double-click a cell to edit it; Enter saves, Esc cancels. A segment’s page has its surveys, treatments and
          every attribute.
        </p>
      )}
    </div>
  );
}
