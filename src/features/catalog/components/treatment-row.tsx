import { useId, useState } from 'react';
import { toast } from 'sonner';
import {
  COST_BASIS_LABELS,
  type CostItem,
  type Mix,
  type Treatment,
  TREATMENT_KIND_LABELS,
  TreatmentInputSchema,
} from '@shared/schemas/catalog';
import { issuesOf, numberFrom, useFormErrors } from '@/lib/form-errors';
import { useUpdateTreatment } from '../api/update-treatment';
import { appliesText, classesText, costItemText, effectText, lifeText, surfacesText } from '../lib/labels';
import { today } from '../lib/today';
import { DemoTag } from './demo-tag';
import { EditPanel, OpenEdit } from './edit-panel';

type Draft = { amounts: string[]; date: string };
export const TREATMENT_COLUMNS = 8;

// Percent add-ons are typed in percent and stored as fractions.
const shown = (c: CostItem) => String(c.basis === 'percent' ? +(c.amount * 100).toFixed(6) : c.amount);
const stored = (c: CostItem, raw: string) => (c.basis === 'percent' ? numberFrom(raw) / 100 : numberFrom(raw));
const unit = (c: CostItem) => (c.basis === 'percent' ? '%' : `$ ${COST_BASIS_LABELS[c.basis]}`);

export function TreatmentRow({
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
  const id = useId();
  const [draft, setDraft] = useState<Draft | null>(null);
  const save = useUpdateTreatment(agencyId);
  const form = useFormErrors();
  const mix = mixes.find((m) => m.id === t.mixId);
  const { id: treatmentId, isDemo: _demo, ...current } = t;
  const edited = [...t.costItems.map((_, i) => `costItems.${i}.amount`), 'priceEffectiveDate'];
  const open = () => {
    form.clear();
    setDraft({ amounts: t.costItems.map(shown), date: today() });
  };
  const submit = () => {
    if (!draft) return;
    const input = form.check(TreatmentInputSchema, {
      ...current,
      costItems: t.costItems.map((c, i) => ({ ...c, amount: stored(c, draft.amounts[i]) })),
      priceEffectiveDate: draft.date,
    });
    if (!input) return;
    save.mutate(
      { id: treatmentId, input },
      {
        onSuccess: () => {
          toast.success(`${t.name} saved; its prices take effect on ${input.priceEffectiveDate}`);
          setDraft(null);
        },
        onError: (e) => {
          form.fromError(e);
          if (!issuesOf(e).length) toast.error(e.message);
        },
      },
    );
  };
  const change = (key: string, v: (d: Draft) => Draft) => {
    setDraft((d) => (d ? v(d) : d));
    form.clear(key);
  };
  return (
    <>
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
              {mix.name}, {t.defaultThicknessIn} in{t.millDepthIn ? `, milled ${t.millDepthIn} in` : ''}
            </div>
          )}
          {t.costItems.map((c, i) => (
            <div key={`${c.label}-${i}`} className="text-xs">
              {costItemText(c)}
            </div>
          ))}
        </td>
        <td className="text-right">{lifeText(t.lifeYears)}</td>
        <td>{effectText(t.effect)}</td>
        <td className="text-xs">
          {appliesText(t.applicability)}
          <div className="text-asphalt-muted">
            {surfacesText(t.applicability)}; {classesText(t.applicability)}
          </div>
        </td>
        <td className="text-right whitespace-nowrap">{t.priceEffectiveDate}</td>
        <td className="text-right">
          {canEdit && !draft && <OpenEdit label="Change prices" itemName={t.name} onOpen={open} />}
        </td>
      </tr>
      {draft && (
        <EditPanel
          id={id}
          colSpan={TREATMENT_COLUMNS}
          itemName={t.name}
          fields={[
            ...t.costItems.map((c, i) => ({
              key: `costItems.${i}.amount`,
              label: `${c.label} (${unit(c)})`,
              value: draft.amounts[i],
              onChange: (v: string) =>
                change(`costItems.${i}.amount`, (d) => ({ ...d, amounts: d.amounts.map((x, k) => (k === i ? v : x)) })),
            })),
            {
              key: 'priceEffectiveDate',
              label: 'Takes effect',
              type: 'date' as const,
              className: 'w-40',
              value: draft.date,
              onChange: (v: string) => change('priceEffectiveDate', (d) => ({ ...d, date: v })),
            },
          ]}
          error={form.error}
          others={form.others(edited)}
          saving={save.isPending}
          onSave={submit}
          onCancel={() => setDraft(null)}
        />
      )}
    </>
  );
}
