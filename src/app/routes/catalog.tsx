import { useState } from 'react';
import { toast } from 'sonner';
import {
  type Economics,
  type Mix,
  MODIFIER_LABELS,
  type Treatment,
  TREATMENT_KIND_LABELS,
} from '@shared/schemas/catalog';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { Card, PageHeader } from '@/components/ui/page';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { usePriceHistory } from '@/features/catalog/api/get-price-history';
import { useSaveEconomics, useSaveMix, useSaveTreatment } from '@/features/catalog/api/save-catalog';
import { fmt2, fmtMoney } from '@/lib/format';
import { useAgency } from '../use-agency';

const today = () => new Date().toISOString().slice(0, 10);

function DemoTag({ show }: { show: boolean }) {
  return show ? (
    <span className="ml-1 rounded bg-caution-bg px-1.5 py-0.5 text-[10px] font-bold uppercase text-caution">
      demo values
    </span>
  ) : null;
}

function MixRow({ m, canEdit, agencyId }: { m: Mix; canEdit: boolean; agencyId: string }) {
  const [edit, setEdit] = useState(false);
  const [price, setPrice] = useState(String(m.pricePerTon));
  const [life, setLife] = useState(String(m.refLifeYears));
  const [date, setDate] = useState(today());
  const save = useSaveMix(agencyId);
  const { id, isDemo: _d, ...input } = m;
  return (
    <tr className="border-t border-asphalt-line/60 align-top">
      <td className="py-1.5 font-semibold">
        {m.name}
        <DemoTag show={m.isDemo} />
      </td>
      <td>{m.binderGrade}</td>
      <td>{MODIFIER_LABELS[m.modifier]}</td>
      <td className="text-right">
        {edit ? (
          <TextInput
            aria-label={`Price of ${m.name}`}
            className="w-20 text-right"
            value={price}
            onChange={(e) => setPrice(e.target.value)}
          />
        ) : (
          fmtMoney(m.pricePerTon)
        )}
      </td>
      <td className="text-right">{m.spreadRateLbPerSyIn}</td>
      <td className="text-right">
        {fmt2(m.minLiftIn)}–{fmt2(m.maxLiftIn)}
      </td>
      <td className="text-right">
        {edit ? (
          <TextInput
            aria-label={`Life of ${m.name}`}
            className="w-16 text-right"
            value={life}
            onChange={(e) => setLife(e.target.value)}
          />
        ) : (
          `${m.refLifeYears} yr at ${m.refLiftIn} in`
        )}
      </td>
      <td className="text-right">
        {edit ? (
          <TextInput
            aria-label="Effective date"
            type="date"
            className="w-36"
            value={date}
            onChange={(e) => setDate(e.target.value)}
          />
        ) : (
          m.priceEffectiveDate
        )}
      </td>
      <td className="text-right">
        {canEdit &&
          (edit ? (
            <span className="flex justify-end gap-1">
              <Button
                onClick={() =>
                  save.mutate(
                    {
                      id,
                      input: {
                        ...input,
                        pricePerTon: Number(price),
                        refLifeYears: Number(life),
                        priceEffectiveDate: date,
                      },
                    },
                    {
                      onSuccess: () => {
                        toast.success(`${m.name} saved`);
                        setEdit(false);
                      },
                      onError: (e) => toast.error(e.message),
                    },
                  )
                }
              >
                Save
              </Button>
              <Button variant="ghost" onClick={() => setEdit(false)}>
                Cancel
              </Button>
            </span>
          ) : (
            <Button variant="ghost" onClick={() => setEdit(true)}>
              Change price
            </Button>
          ))}
      </td>
    </tr>
  );
}

function TreatmentRow({
  t,
  mixes,
  canEdit,
  agencyId,
}: {
  t: Treatment;
  mixes: Mix[];
  canEdit: boolean;
  agencyId: string;
}) {
  const [edit, setEdit] = useState(false);
  const [items, setItems] = useState(t.costItems.map((c) => String(c.amount)));
  const [date, setDate] = useState(today());
  const save = useSaveTreatment(agencyId);
  const mix = mixes.find((m) => m.id === t.mixId);
  const { id, isDemo: _d, ...input } = t;
  return (
    <tr className="border-t border-asphalt-line/60 align-top">
      <td className="py-1.5 font-semibold">
        {t.name}
        <DemoTag show={t.isDemo} />
      </td>
      <td>
        {TREATMENT_KIND_LABELS[t.kind]}
        <div className="text-xs text-asphalt-muted">{t.category}</div>
      </td>
      <td>
        {mix && (
          <div>
            {mix.name}, {t.defaultThicknessIn} in
          </div>
        )}
        {t.costItems.map((c, i) => (
          <div key={c.label} className="flex items-center gap-1 text-xs">
            {c.label}:{' '}
            {edit ? (
              <TextInput
                aria-label={`${t.name} ${c.label}`}
                className="w-20"
                value={items[i]}
                onChange={(e) => setItems(items.map((x, k) => (k === i ? e.target.value : x)))}
              />
            ) : c.basis === 'percent' ? (
              `${(c.amount * 100).toFixed(1)} %`
            ) : (
              `${fmtMoney(c.amount)}/${c.basis.replace('per_', '').replace('_', '-').replace('sy', 'SY')}`
            )}
          </div>
        ))}
      </td>
      <td className="text-right">{t.lifeYears === null ? 'by mix and lift' : `${t.lifeYears} yr`}</td>
      <td>
        {t.effect.type === 'reset' ? `to PCI ${t.effect.value}` : `+${t.effect.value} PCI`}
        {t.effect.resetsAge ? '' : ', no age reset'}
      </td>
      <td className="text-xs">
        PCI {t.applicability.pciMin}–{t.applicability.pciMax}; ≥ {t.applicability.minYearsSinceLast} yr since last
      </td>
      <td className="text-right">
        {edit ? (
          <TextInput
            aria-label="Effective date"
            type="date"
            className="w-36"
            value={date}
            onChange={(e) => setDate(e.target.value)}
          />
        ) : (
          t.priceEffectiveDate
        )}
      </td>
      <td className="text-right">
        {canEdit &&
          (edit ? (
            <span className="flex justify-end gap-1">
              <Button
                onClick={() =>
                  save.mutate(
                    {
                      id,
                      input: {
                        ...input,
                        costItems: t.costItems.map((c, i) => ({ ...c, amount: Number(items[i]) })),
                        priceEffectiveDate: date,
                      },
                    },
                    {
                      onSuccess: () => {
                        toast.success(`${t.name} saved`);
                        setEdit(false);
                      },
                      onError: (e) => toast.error(e.message),
                    },
                  )
                }
              >
                Save
              </Button>
              <Button variant="ghost" onClick={() => setEdit(false)}>
                Cancel
              </Button>
            </span>
          ) : (
            <Button variant="ghost" onClick={() => setEdit(true)}>
              Change prices
            </Button>
          ))}
      </td>
    </tr>
  );
}

function EconomicsCard({ e, canEdit, agencyId }: { e: Economics; canEdit: boolean; agencyId: string }) {
  const [form, setForm] = useState(e);
  const save = useSaveEconomics(agencyId);
  const field = (k: keyof Economics, label: string, scale = 1, step = '1') => (
    <label className="text-sm">
      <span className="block text-xs text-asphalt-muted">{label}</span>
      <TextInput
        aria-label={label}
        type="number"
        step={step}
        disabled={!canEdit}
        value={Number(form[k]) * scale}
        onChange={(ev) => setForm({ ...form, [k]: Number(ev.target.value) / scale })}
      />
    </label>
  );
  return (
    <Card title="Economics">
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        {field('discountRate', 'Discount rate, real (%)', 100, '0.1')}
        {field('analysisPeriodYears', 'Analysis period (yr)')}
        {field('baseYear', 'Base year (constant dollars)')}
        {field('mobilizationPerJob', 'Mobilisation ($/job)')}
        {field('trafficControlPerDay', 'Traffic control ($/day)')}
        {field('engineeringFraction', 'Engineering (%)', 100, '0.5')}
        {field('contingencyFraction', 'Contingency (%)', 100, '0.5')}
      </div>
      <label className="mt-3 block text-sm">
        <span className="block text-xs text-asphalt-muted">Source of the discount rate</span>
        <TextInput
          aria-label="Source of the discount rate"
          disabled={!canEdit}
          value={form.discountRateSource ?? ''}
          onChange={(ev) => setForm({ ...form, discountRateSource: ev.target.value || null })}
          placeholder="e.g. OMB Circular A-94, Appendix C (real rate, year)"
        />
      </label>
      {canEdit && (
        <Button
          className="mt-3"
          onClick={() =>
            save.mutate(form, {
              onSuccess: () => toast.success('Economics saved'),
              onError: (err) => toast.error(err.message),
            })
          }
        >
          Save economics
        </Button>
      )}
    </Card>
  );
}

export function CatalogPage() {
  const { agencyId, membership } = useAgency();
  const canEdit = membership?.role === 'admin';
  const c = useCatalog(agencyId);
  const [showHistory, setShowHistory] = useState(false);
  const history = usePriceHistory(agencyId, showHistory);
  if (c.isLoading || !c.data) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  const d = c.data;
  return (
    <div className="space-y-5">
      <PageHeader
        title="Catalog"
        caption={
          canEdit
            ? 'The agency’s mixes, treatments and economics. Each price keeps the date it takes effect; saved comparisons keep the prices they used.'
            : 'The agency’s mixes, treatments and economics (admins change them).'
        }
        actions={
          d.demoValues ? (
            <span className="rounded bg-caution-bg px-2 py-1 text-xs font-semibold text-caution">
              Items tagged “demo values” are invented for the demo county
            </span>
          ) : undefined
        }
      />
      <Card title="Mixes">
        <table className="num w-full text-sm [&_td]:px-2 [&_th]:px-2 [&_td]:whitespace-nowrap" data-testid="mix-table">
          <thead className="text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="py-1">Mix</th>
              <th>Binder</th>
              <th>Modifier</th>
              <th className="text-right">$/ton</th>
              <th className="text-right">lb/SY-in</th>
              <th className="text-right">Lift (in)</th>
              <th className="text-right">Life</th>
              <th className="text-right">Effective</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {d.mixes.map((m) => (
              <MixRow key={m.id} m={m} canEdit={canEdit} agencyId={agencyId} />
            ))}
          </tbody>
        </table>
      </Card>
      <Card title="Treatments">
        <table className="num w-full text-sm [&_td]:px-2 [&_th]:px-2" data-testid="treatment-table">
          <thead className="text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="py-1">Treatment</th>
              <th>Kind</th>
              <th>Cost basis</th>
              <th className="text-right">Life</th>
              <th>Condition effect</th>
              <th>Applies to</th>
              <th className="text-right">Effective</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {d.treatments.map((t) => (
              <TreatmentRow key={t.id} t={t} mixes={d.mixes} canEdit={canEdit} agencyId={agencyId} />
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-xs text-asphalt-muted">
          Every job also carries mobilisation, traffic control by the day (at the treatment’s production rate) and the
          engineering and contingency add-ons below.
        </p>
      </Card>
      <EconomicsCard key={JSON.stringify(d.economics)} e={d.economics} canEdit={canEdit} agencyId={agencyId} />
      {membership?.role !== 'viewer' && (
        <Card title="Price history">
          {!showHistory ? (
            <Button variant="secondary" onClick={() => setShowHistory(true)}>
              Show price history
            </Button>
          ) : history.data?.items.length ? (
            <table className="num w-full text-sm">
              <thead className="text-left text-xs uppercase text-asphalt-muted">
                <tr>
                  <th className="py-1">Item</th>
                  <th>Field</th>
                  <th>Before</th>
                  <th>After</th>
                  <th>Effective</th>
                  <th>By</th>
                </tr>
              </thead>
              <tbody>
                {history.data.items.map((h, i) => (
                  <tr key={i} className="border-t border-asphalt-line/60">
                    <td className="py-1">{h.name}</td>
                    <td>{h.field}</td>
                    <td className="max-w-xs truncate">{JSON.stringify(h.before)}</td>
                    <td className="max-w-xs truncate">{JSON.stringify(h.after)}</td>
                    <td>{h.effectiveDate}</td>
                    <td>{h.userName ?? '—'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p className="text-sm text-asphalt-muted">No price changes yet.</p>
          )}
        </Card>
      )}
    </div>
  );
}
