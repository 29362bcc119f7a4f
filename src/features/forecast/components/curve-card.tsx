import { useState } from 'react';
import { toast } from 'sonner';
import { ageAt, type Curve } from '@shared/engine/forecast/curve';
import { MIN_POINTS_TO_FIT } from '@shared/engine/forecast/families';
import { CurveSchema, type Family } from '@shared/schemas/forecast';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';
import { numberFrom, useFieldErrors } from '@/components/ui/form-errors';
import { fmt1, fmt2, fmtInt } from '@/lib/format';
import { useSetCurve } from '../api/set-curve';
import { familyTitle } from '../lib/labels';
import { CurveChart } from './curve-chart';
import { type CurveDraft, CurveEditor } from './curve-editor';

const formula = (c: Curve) => `PCI = ${fmt2(c.p0)} − ${c.a.toFixed(3)} × age^${c.b.toFixed(2)}`;
const toDraft = (c: Curve): CurveDraft => ({
  p0: String(c.p0),
  a: String(+c.a.toFixed(4)),
  b: String(+c.b.toFixed(3)),
});
const fromDraft = (d: CurveDraft) => ({ p0: numberFrom(d.p0), a: numberFrom(d.a), b: numberFrom(d.b) });

function whereFrom(f: Family) {
  if (f.source === 'fitted') return `fitted to ${fmtInt(f.n)} surveys, RMSE ${f.rmse?.toFixed(1)} PCI points`;
  if (f.source === 'edited') return 'set by hand for this agency';
  return `a default curve (a planning value, not fitted): ${fmtInt(f.n)} surveys are fewer than the ${MIN_POINTS_TO_FIT} a fit needs`;
}

/** One family: its curve over its surveys, what the curve says, and editing it or going back. */
export function CurveCard({ f, agencyId }: { f: Family; agencyId: string }) {
  const [draft, setDraft] = useState<CurveDraft | null>(null);
  const set = useSetCurve(agencyId);
  const form = useFieldErrors(undefined, [], { general: false });
  const preview = draft ? CurveSchema.safeParse(fromDraft(draft)) : null;
  const fitUsable = !!f.fitted && f.n >= MIN_POINTS_TO_FIT;
  const save = () => {
    if (!draft) return;
    const curve = form.check(CurveSchema, fromDraft(draft));
    if (!curve) return;
    set.mutate(
      { familyKey: f.key, curve },
      {
        onSuccess: () => {
          toast.success('Curve saved; plans use it from their next run');
          setDraft(null);
        },
        onError: (e) => form.fromError(e) || toast.error(e.message),
      },
    );
  };
  const reset = () =>
    set.mutate(
      { familyKey: f.key, curve: null },
      {
        onSuccess: () => toast.success(fitUsable ? 'Back to the fitted curve' : 'Back to the default curve'),
        onError: (e) => toast.error(e.message),
      },
    );
  return (
    <Card title={familyTitle(f)}>
      <p className="mb-2 text-sm" data-testid="fit-caption">
        {formula(f.curve)} ({whereFrom(f)}). It reaches PCI 70 after {fmt1(ageAt(f.curve, 70))} years and 40 after{' '}
        {fmt1(ageAt(f.curve, 40))} years.
      </p>
      <CurveChart f={f} draft={preview?.success ? preview.data : null} />
      <ul className="mt-1 flex flex-wrap gap-x-4 text-xs text-asphalt-muted">
        <li>
          <span className="mr-1 inline-block h-0.5 w-4 bg-accent align-middle" /> the curve plans use
        </li>
        {f.fitted && f.source !== 'fitted' && (
          <li>
            <span className="mr-1 inline-block w-4 border-t border-dashed border-asphalt-muted align-middle" /> the
            least-squares fit to these {fmtInt(f.n)} surveys (RMSE {f.fitted.rmse.toFixed(1)} PCI points), for
            comparison
          </li>
        )}
        {draft && (
          <li>
            <span className="mr-1 inline-block w-4 border-t-2 border-dashed border-caution align-middle" /> your change,
            not saved yet
          </li>
        )}
      </ul>
      <div className="mt-3">
        {draft ? (
          <CurveEditor
            draft={draft}
            onChange={(d, changed) => {
              setDraft(d);
              form.clear(changed);
            }}
            error={form.error}
            saving={set.isPending}
            onSave={save}
            onCancel={() => setDraft(null)}
          />
        ) : (
          <div className="flex flex-wrap gap-2">
            <Button
              variant="secondary"
              onClick={() => {
                form.clear();
                setDraft(toDraft(f.curve));
              }}
            >
              Edit this curve
            </Button>
            {f.source === 'edited' && (
              <Button variant="ghost" onClick={reset} disabled={set.isPending}>
                {fitUsable ? 'Go back to the fitted curve' : 'Go back to the default curve'}
              </Button>
            )}
          </div>
        )}
      </div>
    </Card>
  );
}
