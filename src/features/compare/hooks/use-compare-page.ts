// The state of the Compare screen: the roads, the alternatives and the run
// settings on the left; the result on the right (a finished run, or a saved
// comparison), with what it was run on so a changed input marks it out of date.
import { useEffect, useMemo, useRef, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { toast } from 'sonner';
import type { AlternativeSpec, Group, ComparisonRequest } from '@shared/schemas/comparisons';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { useSegments } from '@/features/segments/api/get-segments';
import { type SavedComparison, useComparison } from '../api/comparisons';
import { useStartComparison, useComparisonRun } from '../api/comparison-runs';
import { defaultAlternatives } from '../lib/default-alternatives';
import { basisOf, basisOfSaved, changesSince, type RunBasis } from '../lib/run-basis';
import { DEFAULT_SECTION, type Roads, roadsOfGroup, segmentGroup, typedGroup } from '../lib/roads';

/** Segment rows fetched to show the picked roads by id and name (the ids filter takes up to 5,000). */
const SHOWN_ROADS_LIMIT = 1000;

const idsFromUrl = (params: URLSearchParams) =>
  (params.get('segments') ?? '')
    .split(',')
    .map(Number)
    .filter((n) => Number.isInteger(n) && n > 0);

export function useComparePage(agencyId: string) {
  const [params, setParams] = useSearchParams();
  const catalog = useCatalog(agencyId);
  const comparisonId = params.get('analysis');
  const saved = useComparison(agencyId, comparisonId);
  const [roads, setRoads] = useState<Roads>(() => {
    const ids = idsFromUrl(params);
    return ids.length ? { kind: 'segments', ids } : { kind: 'typed', section: DEFAULT_SECTION };
  });
  const [alts, setAlts] = useState<AlternativeSpec[] | null>(null);
  const [baseline, setBaseline] = useState(0);
  const [iterations, setIterations] = useState(5000);
  const [name, setName] = useState('');
  const [runId, setRunId] = useState<string | null>(null);
  const [runBasis, setRunBasis] = useState<RunBasis | null>(null);
  const run = useComparisonRun(agencyId, runId);
  const start = useStartComparison(agencyId);

  // Roads picked under Roads arrive in the URL.
  const urlIds = params.get('segments');
  useEffect(() => {
    const ids = idsFromUrl(new URLSearchParams(urlIds ? { segments: urlIds } : {}));
    if (ids.length) setRoads({ kind: 'segments', ids });
  }, [urlIds]);

  useEffect(() => {
    if (catalog.data && !alts) setAlts(defaultAlternatives(catalog.data));
  }, [catalog.data, alts]);

  // A saved comparison brings back its roads and inputs, once per opening (a refetch keeps the user's edits).
  const loaded = useRef<string | null>(null);
  const restore = (data: SavedComparison) => {
    loaded.current = data.id;
    const input = data.input;
    setRoads(roadsOfGroup(input.group));
    setAlts(input.alternatives);
    setBaseline(input.baselineIndex);
    setIterations(input.risk.iterations);
    setName(data.name);
    setRunId(null);
    setRunBasis(null);
  };
  const restoreRef = useRef(restore);
  restoreRef.current = restore;
  useEffect(() => {
    if (saved.data && loaded.current !== saved.data.id) restoreRef.current(saved.data);
  }, [saved.data]);

  const ids = roads.kind === 'segments' ? roads.ids : [];
  const selection = useSegments(agencyId, {
    ids: ids.slice(0, 5000).join(',') || undefined,
    limit: ids.length ? Math.min(SHOWN_ROADS_LIMIT, ids.length) : 1,
  });

  const group: Group | null = useMemo(() => {
    if (roads.kind === 'typed') return typedGroup(roads.section);
    const totals = selection.data?.totals;
    return totals && ids.length ? segmentGroup(ids, totals) : null;
  }, [roads, ids, selection.data?.totals]);

  const request: ComparisonRequest | null =
    alts && group
      ? {
          name: name || group.label,
          group,
          alternatives: alts,
          baselineIndex: Math.min(baseline, alts.length - 1),
          risk: { iterations, seed: 2027, ranges: {} },
        }
      : null;

  const nowBasis =
    alts && catalog.data ? basisOf(roads, alts, Math.min(baseline, alts.length - 1), iterations, catalog.data) : null;
  const live = runId && run.data?.status === 'done' ? (run.data.result ?? null) : null;
  const fromSaved = !runId && saved.data?.result ? saved.data.result : null;
  const result = live ?? fromSaved;
  const ranOn = live ? runBasis : fromSaved && saved.data ? basisOfSaved(saved.data.input) : null;
  const changes = result && ranOn && nowBasis ? changesSince(ranOn, nowBasis) : [];

  const compare = () => {
    if (!request || !nowBasis) return;
    const basis = nowBasis;
    start.mutate(request, {
      onSuccess: (r) => {
        setRunId(r.id);
        setRunBasis(basis);
      },
      onError: (e) => toast.error(e.message),
    });
  };

  const openSaved = (id: string) => {
    setRunId(null);
    // Opening the one already shown puts its inputs back; another loads through the effect above.
    if (id === comparisonId && saved.data?.id === id) restore(saved.data);
    else {
      loaded.current = null;
      setParams(new URLSearchParams({ analysis: id }));
    }
  };

  const switchToTypedSection = () => {
    setRoads({ kind: 'typed', section: DEFAULT_SECTION });
    setParams(new URLSearchParams());
  };

  return {
    catalog,
    comparisonId,
    saved,
    roads,
    setRoads,
    selection,
    group,
    alts,
    setAlts,
    baseline,
    setBaseline,
    iterations,
    setIterations,
    name,
    setName,
    runId,
    setRunId,
    setRunBasis,
    run,
    start,
    running: run.data?.status === 'running' || start.isPending,
    result,
    changes,
    compare,
    openSaved,
    switchToTypedSection,
    setParams,
  };
}

export type ComparePage = ReturnType<typeof useComparePage>;
