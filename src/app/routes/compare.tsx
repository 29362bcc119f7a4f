import { useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { toast } from 'sonner';
import type { Catalog } from '@shared/schemas/catalog';
import { FUNCTIONAL_CLASSES } from '@shared/schemas/segments';
import type { AlternativeSpec, Group, StudyRequest } from '@shared/schemas/lcca';
import { areaSy, laneMiles } from '@shared/engine/quantities';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { useAnalyses, useAnalysis, useRerunAnalysis, useSaveAnalysis } from '@/features/compare/api/analyses';
import { useStartStudy, useStudyRun } from '@/features/compare/api/study-runs';
import { AlternativeCard } from '@/features/compare/components/alternative-card';
import { StudyResults } from '@/features/compare/components/study-results';
import { useSegments } from '@/features/segments/api/get-segments';
import { CLASS_LABELS, fmt1, fmtInt } from '@/lib/format';
import { useAgency } from '../use-agency';

function defaultAlternatives(c: Catalog): AlternativeSpec[] {
  const t = (kind: string) => c.treatments.find((x) => x.kind === kind);
  const mill = t('mill_and_overlay');
  const seal = t('crack_seal');
  const chip = t('chip_seal');
  const rubber = c.mixes.find((m) => m.modifier === 'crumb_rubber_dry');
  const maint = seal ? [{ treatmentId: seal.id, everyYears: 4 }] : [];
  const out: AlternativeSpec[] = [];
  if (mill)
    out.push({
      name: `${mill.name}, catalog mix`,
      initial: { treatmentId: mill.id },
      rehabilitation: [],
      maintenance: maint,
      repeatAtEndOfLife: true,
    });
  if (mill && rubber)
    out.push({
      name: `${rubber.name}, ${rubber.refLiftIn} in`,
      initial: { treatmentId: mill.id, mixId: rubber.id, thicknessIn: rubber.refLiftIn },
      rehabilitation: [],
      maintenance: maint,
      repeatAtEndOfLife: true,
    });
  if (chip)
    out.push({
      name: 'Chip seal cycle',
      initial: { treatmentId: chip.id },
      rehabilitation: [],
      maintenance: [],
      repeatAtEndOfLife: true,
    });
  while (out.length < 2 && c.treatments[out.length])
    out.push({
      name: c.treatments[out.length].name,
      initial: { treatmentId: c.treatments[out.length].id },
      rehabilitation: [],
      maintenance: [],
      repeatAtEndOfLife: true,
    });
  return out;
}

type Typed = {
  lengthMi: number;
  widthFt: number;
  lanes: number;
  adt: number;
  truckPct: number;
  pci: number;
  functionalClass: string;
};

export function ComparePage() {
  const { agencyId } = useAgency();
  const [params, setParams] = useSearchParams();
  const catalog = useCatalog(agencyId);
  const ids = useMemo(
    () =>
      (params.get('segments') ?? '')
        .split(',')
        .map(Number)
        .filter((n) => Number.isInteger(n) && n > 0),
    [params],
  );
  const selection = useSegments(agencyId, { ids: ids.join(',') || undefined, limit: ids.length ? 1000 : 1 });
  const [typed, setTyped] = useState<Typed>({
    lengthMi: 1,
    widthFt: 24,
    lanes: 2,
    adt: 1500,
    truckPct: 8,
    pci: 55,
    functionalClass: 'major_collector',
  });
  const [alts, setAlts] = useState<AlternativeSpec[] | null>(null);
  const [baseline, setBaseline] = useState(0);
  const [iterations, setIterations] = useState(5000);
  const [runId, setRunId] = useState<string | null>(null);
  const [name, setName] = useState('');
  const analysisId = params.get('analysis');
  const saved = useAnalysis(agencyId, analysisId);
  const list = useAnalyses(agencyId);
  const start = useStartStudy(agencyId);
  const save = useSaveAnalysis(agencyId);
  const rerun = useRerunAnalysis(agencyId);
  const run = useStudyRun(agencyId, runId);

  useEffect(() => {
    if (catalog.data && !alts) setAlts(defaultAlternatives(catalog.data));
  }, [catalog.data, alts]);
  useEffect(() => {
    if (saved.data) {
      setAlts(saved.data.input.alternatives);
      setBaseline(saved.data.input.baselineIndex);
      setIterations(saved.data.input.risk.iterations);
      setName(saved.data.name);
    }
  }, [saved.data]);

  if (catalog.isLoading || !alts) return <div className="text-sm text-asphalt-muted">Loading the catalog…</div>;
  if (!catalog.data || catalog.data.treatments.length === 0)
    return <EmptyState>The catalog has no treatments yet — an admin adds them under Catalog.</EmptyState>;
  const cat = catalog.data;

  const items = selection.data?.items ?? [];
  const fromSegments = ids.length > 0 && items.length > 0;
  const group: Group = fromSegments
    ? {
        label: `${items.length} selected segment${items.length === 1 ? '' : 's'}`,
        segmentIds: items.map((s) => s.id),
        areaSy: items.reduce((s, x) => s + x.areaSy, 0),
        laneMiles: items.reduce((s, x) => s + x.laneMiles, 0),
        centrelineMiles: items.reduce((s, x) => s + x.lengthMi, 0),
        segments: items.map((s) => ({
          segmentId: s.segmentId,
          adt: s.adt,
          truckPct: s.truckPct,
          functionalClass: s.functionalClass,
          pci: s.pci,
        })),
      }
    : {
        label: `Typed-in section, ${typed.lengthMi} mi × ${typed.widthFt} ft`,
        segmentIds: [],
        areaSy: areaSy(typed.lengthMi, typed.widthFt),
        laneMiles: laneMiles(typed.lengthMi, typed.lanes),
        centrelineMiles: typed.lengthMi,
        segments: [
          {
            segmentId: 'typed-in',
            adt: typed.adt,
            truckPct: typed.truckPct,
            functionalClass: typed.functionalClass as Group['segments'][number]['functionalClass'],
            pci: typed.pci,
          },
        ],
      };

  const request: StudyRequest = {
    name: name || group.label,
    group,
    alternatives: alts,
    baselineIndex: Math.min(baseline, alts.length - 1),
    risk: { iterations, seed: 2027, ranges: {} },
  };
  const running = run.data?.status === 'running' || start.isPending;
  const result = run.data?.status === 'done' ? run.data.result : !runId ? (saved.data?.result ?? null) : null;
  const go = () =>
    start.mutate(request, {
      onSuccess: (r) => setRunId(r.id),
      onError: (e) => toast.error(e.message),
    });
  const setAlt = (i: number, s: AlternativeSpec) => setAlts(alts.map((a, k) => (k === i ? s : a)));

  return (
    <div>
      <PageHeader
        title="Compare"
        caption="Life-cycle cost of 2–6 alternatives on one group of roads: present value, EUAC, the cost lines behind them, and how sure the answer is."
        actions={
          cat.demoValues ? (
            <span className="rounded bg-caution-bg px-2 py-1 text-xs font-semibold text-caution">
              catalog holds demo values
            </span>
          ) : undefined
        }
      />
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <div className="space-y-3">
          <Card title="Roads">
            {fromSegments ? (
              <div className="text-sm" data-testid="compare-selection">
                <strong>{items.length}</strong> segment{items.length === 1 ? '' : 's'} from Roads:{' '}
                {fmt1(group.centrelineMiles)} mi, {fmt1(group.laneMiles)} lane-mi, {fmtInt(group.areaSy)} SY.
                <button
                  type="button"
                  className="ml-2 text-xs text-accent hover:underline"
                  onClick={() => setParams(new URLSearchParams())}
                >
                  Type in a section instead
                </button>
              </div>
            ) : (
              <div className="grid grid-cols-3 gap-2 text-sm" data-testid="typed-section">
                {(['lengthMi', 'widthFt', 'lanes', 'adt', 'truckPct', 'pci'] as const).map((k) => (
                  <label key={k}>
                    <span className="text-xs text-asphalt-muted">
                      {
                        {
                          lengthMi: 'Length (mi)',
                          widthFt: 'Width (ft)',
                          lanes: 'Lanes',
                          adt: 'ADT',
                          truckPct: 'Trucks (%)',
                          pci: 'PCI',
                        }[k]
                      }
                    </span>
                    <TextInput
                      aria-label={k}
                      type="number"
                      value={typed[k]}
                      onChange={(e) => setTyped({ ...typed, [k]: Number(e.target.value) })}
                    />
                  </label>
                ))}
                <label className="col-span-3">
                  <span className="text-xs text-asphalt-muted">Functional class</span>
                  <Select
                    aria-label="Class of typed-in section"
                    value={typed.functionalClass}
                    onChange={(e) => setTyped({ ...typed, functionalClass: e.target.value })}
                  >
                    {FUNCTIONAL_CLASSES.map((c) => (
                      <option key={c} value={c}>
                        {CLASS_LABELS[c]}
                      </option>
                    ))}
                  </Select>
                </label>
                <p className="col-span-3 text-xs text-asphalt-muted">
                  Or pick segments under Roads and choose “Compare alternatives for selection”.
                </p>
              </div>
            )}
          </Card>
          {alts.map((a, i) => (
            <AlternativeCard
              key={i}
              index={i}
              spec={a}
              catalog={cat}
              onChange={(s) => setAlt(i, s)}
              onRemove={alts.length > 2 ? () => setAlts(alts.filter((_, k) => k !== i)) : undefined}
            />
          ))}
          <div className="flex flex-wrap items-center gap-2 text-sm">
            {alts.length < 6 && (
              <Button
                variant="secondary"
                onClick={() => setAlts([...alts, { ...alts[alts.length - 1], name: `Alternative ${alts.length + 1}` }])}
              >
                Add alternative
              </Button>
            )}
            <label className="flex items-center gap-1">
              Baseline
              <Select
                aria-label="Baseline"
                className="w-44"
                value={baseline}
                onChange={(e) => setBaseline(Number(e.target.value))}
              >
                {alts.map((a, i) => (
                  <option key={i} value={i}>
                    {a.name}
                  </option>
                ))}
              </Select>
            </label>
            <label className="flex items-center gap-1">
              Monte Carlo draws
              <TextInput
                aria-label="Iterations"
                type="number"
                min={100}
                max={20000}
                step={500}
                className="w-24"
                value={iterations}
                onChange={(e) => setIterations(Number(e.target.value))}
              />
            </label>
          </div>
          <div className="flex items-center gap-3">
            <Button onClick={go} disabled={running}>
              {running ? 'Running…' : 'Compare'}
            </Button>
            {run.data?.status === 'running' && (
              <>
                <div
                  className="h-2 w-40 overflow-hidden rounded bg-asphalt-line"
                  role="progressbar"
                  aria-valuenow={Math.round(run.data.progress * 100)}
                >
                  <div className="h-full bg-accent" style={{ width: `${Math.round(run.data.progress * 100)}%` }} />
                </div>
                <Button variant="ghost" onClick={run.cancel}>
                  Cancel
                </Button>
              </>
            )}
            {run.data?.status === 'failed' && (
              <span role="alert" className="text-sm text-band-failed">
                {run.data.error?.message}
              </span>
            )}
            {run.data?.status === 'cancelled' && <span className="text-sm text-asphalt-muted">Cancelled.</span>}
          </div>
          <Card title="Saved comparisons">
            {list.data?.items.length ? (
              <ul className="divide-y divide-asphalt-line/60 text-sm">
                {list.data.items.map((s) => (
                  <li key={s.id} className="flex items-center justify-between py-1">
                    <button
                      type="button"
                      className="text-left text-accent hover:underline"
                      onClick={() => {
                        setRunId(null);
                        setParams(new URLSearchParams({ analysis: s.id }));
                      }}
                    >
                      {s.name}
                    </button>
                    <span className="num text-xs text-asphalt-muted">
                      {s.alternatives} alternatives · {fmt1(s.laneMiles)} lane-mi · {s.updatedAt.slice(0, 10)}
                    </span>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-sm text-asphalt-muted">None yet. Run a comparison, then save it with its inputs.</p>
            )}
          </Card>
        </div>
        <div>
          {result ? (
            <>
              <div className="mb-3 flex flex-wrap items-center gap-2">
                {runId && run.data?.status === 'done' && (
                  <>
                    <TextInput
                      aria-label="Comparison name"
                      placeholder="Name this comparison"
                      className="w-64"
                      value={name}
                      onChange={(e) => setName(e.target.value)}
                    />
                    <Button
                      variant="secondary"
                      disabled={save.isPending}
                      onClick={() =>
                        save.mutate(
                          { name: name || group.label, runId },
                          {
                            onSuccess: (s) => {
                              toast.success('Saved with all its inputs');
                              setParams(new URLSearchParams({ analysis: s.id }));
                              setRunId(null);
                            },
                            onError: (e) => toast.error(e.message),
                          },
                        )
                      }
                    >
                      Save
                    </Button>
                  </>
                )}
                {analysisId && !runId && (
                  <>
                    <span className="text-sm text-asphalt-muted">Saved: {saved.data?.name}</span>
                    <a
                      className="text-sm font-semibold text-accent hover:underline"
                      href={`/api/agencies/${agencyId}/analyses/${analysisId}/export?format=csv`}
                    >
                      CSV
                    </a>
                    <a
                      className="text-sm font-semibold text-accent hover:underline"
                      href={`/api/agencies/${agencyId}/analyses/${analysisId}/export?format=xlsx`}
                    >
                      XLSX
                    </a>
                    <Button
                      variant="ghost"
                      onClick={() => rerun.mutate(analysisId, { onSuccess: (r) => setRunId(r.id) })}
                    >
                      Re-run at its own prices
                    </Button>
                  </>
                )}
              </div>
              <StudyResults r={result} />
            </>
          ) : (
            <EmptyState>
              Set up the alternatives and choose Compare. The answer appears here: ranked present values, cash flows,
              sensitivity and the Monte Carlo spread.
            </EmptyState>
          )}
        </div>
      </div>
    </div>
  );
}
