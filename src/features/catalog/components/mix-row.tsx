import { useId, useState } from 'react';
import { toast } from 'sonner';
import { type Mix, MixInputSchema, MODIFIER_LABELS } from '@shared/schemas/catalog';
import { issuesOf, numberFrom, useFormErrors } from '@/lib/form-errors';
import { fmt2, fmtMoney } from '@/lib/format';
import { useUpdateMix } from '../api/update-mix';
import { today } from '../lib/today';
import { DemoTag } from './demo-tag';
import { EditPanel, OpenEdit } from './edit-panel';

type Draft = { pricePerTon: string; refLifeYears: string; priceEffectiveDate: string };
export const MIX_COLUMNS = 9;

export function MixRow({ m, canEdit, agencyId }: { m: Mix; canEdit: boolean; agencyId: string }) {
  const id = useId();
  const [draft, setDraft] = useState<Draft | null>(null);
  const save = useUpdateMix(agencyId);
  const form = useFormErrors();
  const { id: mixId, isDemo: _demo, ...current } = m;
  const open = () => {
    form.clear();
    setDraft({ pricePerTon: String(m.pricePerTon), refLifeYears: String(m.refLifeYears), priceEffectiveDate: today() });
  };
  const change = (key: keyof Draft) => (v: string) => {
    setDraft((d) => (d ? { ...d, [key]: v } : d));
    form.clear(key);
  };
  const submit = () => {
    if (!draft) return;
    const input = form.check(MixInputSchema, {
      ...current,
      pricePerTon: numberFrom(draft.pricePerTon),
      refLifeYears: numberFrom(draft.refLifeYears),
      priceEffectiveDate: draft.priceEffectiveDate,
    });
    if (!input) return;
    save.mutate(
      { id: mixId, input },
      {
        onSuccess: () => {
          toast.success(`${m.name} saved; its price takes effect on ${input.priceEffectiveDate}`);
          setDraft(null);
        },
        onError: (e) => {
          form.fromError(e);
          if (!issuesOf(e).length) toast.error(e.message);
        },
      },
    );
  };
  return (
    <>
      <tr className="border-t border-asphalt-line/60 align-top">
        <td className="py-1.5 font-semibold">
          {m.name}
          <DemoTag show={m.isDemo} />
        </td>
        <td className="whitespace-nowrap">{m.binderGrade}</td>
        <td>{MODIFIER_LABELS[m.modifier]}</td>
        <td className="text-right">{fmtMoney(m.pricePerTon)}</td>
        <td className="text-right">{m.spreadRateLbPerSyIn}</td>
        <td className="text-right whitespace-nowrap">
          {fmt2(m.minLiftIn)}–{fmt2(m.maxLiftIn)}
        </td>
        <td className="text-right whitespace-nowrap">{`${m.refLifeYears} yr at ${m.refLiftIn} in`}</td>
        <td className="text-right whitespace-nowrap">{m.priceEffectiveDate}</td>
        <td className="text-right">
          {canEdit && !draft && <OpenEdit label="Change price" itemName={m.name} onOpen={open} />}
        </td>
      </tr>
      {draft && (
        <EditPanel
          id={id}
          colSpan={MIX_COLUMNS}
          itemName={m.name}
          fields={[
            { key: 'pricePerTon', label: 'Price ($/ton)', value: draft.pricePerTon, onChange: change('pricePerTon') },
            {
              key: 'refLifeYears',
              label: `Life at ${m.refLiftIn} in (yr)`,
              value: draft.refLifeYears,
              onChange: change('refLifeYears'),
            },
            {
              key: 'priceEffectiveDate',
              label: 'Takes effect',
              type: 'date',
              className: 'w-40',
              value: draft.priceEffectiveDate,
              onChange: change('priceEffectiveDate'),
            },
          ]}
          error={form.error}
          others={form.others(Object.keys(draft))}
          saving={save.isPending}
          onSave={submit}
          onCancel={() => setDraft(null)}
        />
      )}
    </>
  );
}
