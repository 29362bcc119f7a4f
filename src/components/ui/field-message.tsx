/** The message under one field; the input names it with aria-describedby. */
export function FieldMessage({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <span id={id} role="alert" className="mt-0.5 block text-xs font-normal whitespace-normal text-band-failed">
      {message}
    </span>
  );
}

/** Props that tie an input to its message. */
export const describedBy = (id: string, message: string | undefined) => ({
  'aria-invalid': message ? true : undefined,
  'aria-describedby': message ? id : undefined,
});
