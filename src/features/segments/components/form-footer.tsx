import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/field';

/** The end of a segment form: messages no field shows, then Save (with its busy words) and Cancel. */
export function FormFooter({
  messages,
  pending,
  label,
  pendingLabel,
  onCancel,
}: {
  messages: string[];
  pending: boolean;
  label: string;
  pendingLabel: string;
  onCancel: () => void;
}) {
  return (
    <>
      <FormAlert messages={messages} />
      <div className="flex gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? pendingLabel : label}
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </>
  );
}
