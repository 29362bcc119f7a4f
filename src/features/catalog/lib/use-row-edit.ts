import { useState } from 'react';
import { toast } from 'sonner';
import type { z } from 'zod';
import { useFieldErrors } from '@/components/ui/form-errors';

type Callbacks = { onSuccess: () => void; onError: (e: Error) => void };
export type RowEdit = ReturnType<typeof useRowEdit>;

/**
 * The edit of one catalog row: a draft of the typed text, checked with the
 * shared schema on Save, messages at the fields (from the browser or the
 * server), and the row closed with a message once saved.
 */
export function useRowEdit<D, I>({
  schema,
  start,
  toValue,
  mutate,
  savedMessage,
}: {
  schema: z.ZodType<I>;
  start: () => D;
  toValue: (draft: D) => unknown;
  mutate: (input: I, cb: Callbacks) => void;
  savedMessage: (input: I) => string;
}) {
  const [draft, setDraft] = useState<D | null>(null);
  // The panel names its fields (othersExcept); a failure without field issues is a toast.
  const form = useFieldErrors(undefined, [], { general: false });
  return {
    draft,
    form,
    open: () => {
      form.clear();
      setDraft(start());
    },
    cancel: () => setDraft(null),
    /** A field changed: the new draft, and that field's message goes. */
    change: (key: string, next: (d: D) => D) => {
      setDraft((d) => (d ? next(d) : d));
      form.clear(key);
    },
    submit: () => {
      if (!draft) return;
      const input = form.check(schema, toValue(draft));
      if (input === undefined) return;
      mutate(input, {
        onSuccess: () => {
          toast.success(savedMessage(input));
          setDraft(null);
        },
        onError: (e) => form.fromError(e) || toast.error(e.message),
      });
    },
  };
}
