import { Button } from '@/components/ui/button';
import { describedBy, FieldMessage } from '@/components/ui/field-message';
import { TextInput } from '@/components/ui/field';

export type EditField = {
  key: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  type?: 'text' | 'date';
  className?: string;
};

/** The form under a catalog row: its fields in a line, each with its message, then Save and Cancel. */
export function EditPanel({
  id,
  colSpan,
  itemName,
  fields,
  error,
  others,
  saving,
  onSave,
  onCancel,
}: {
  id: string;
  colSpan: number;
  itemName: string;
  fields: EditField[];
  error: (key: string) => string | undefined;
  others: string[];
  saving: boolean;
  onSave: () => void;
  onCancel: () => void;
}) {
  return (
    <tr className="bg-paper">
      <td colSpan={colSpan} className="py-2">
        <fieldset
          className="m-0 flex min-w-0 flex-wrap items-start gap-3 border-0 p-0"
          aria-label={`Change ${itemName}`}
        >
          {fields.map((f) => {
            const msgId = `${id}-${f.key}`;
            return (
              <label key={f.key} className="text-xs">
                <span className="block font-semibold text-asphalt">{f.label}</span>
                <TextInput
                  aria-label={`${f.label} — ${itemName}`}
                  type={f.type ?? 'text'}
                  inputMode={f.type === 'date' ? undefined : 'decimal'}
                  className={f.className ?? 'w-28 text-right'}
                  value={f.value}
                  onChange={(e) => f.onChange(e.target.value)}
                  {...describedBy(msgId, error(f.key))}
                />
                <FieldMessage id={msgId} message={error(f.key)} />
              </label>
            );
          })}
          <span className="flex gap-1 pt-4">
            <Button onClick={onSave} disabled={saving}>
              {saving ? 'Saving…' : 'Save'}
            </Button>
            <Button variant="ghost" onClick={onCancel}>
              Cancel
            </Button>
          </span>
        </fieldset>
        {others.map((m) => (
          <p key={m} role="alert" className="mt-1 text-xs text-band-failed">
            {m}
          </p>
        ))}
      </td>
    </tr>
  );
}

/** The button that opens a row's form (admins only). */
export function OpenEdit({ label, itemName, onOpen }: { label: string; itemName: string; onOpen: () => void }) {
  return (
    <Button variant="ghost" className="whitespace-nowrap" aria-label={`${label} of ${itemName}`} onClick={onOpen}>
      {label}
    </Button>
  );
}
