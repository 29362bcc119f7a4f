import type { ReactNode } from 'react';
import { Select } from '@/components/ui/field';

/** One filter of the Roads screen: "all" first, then each choice as value and words. */
export function FilterSelect({
  label,
  className,
  value,
  onChange,
  all,
  choices,
  children,
}: {
  label: string;
  className: string;
  value: string | undefined;
  onChange: (value: string) => void;
  all: string;
  choices: readonly (readonly [value: string, words: ReactNode])[];
  /** Choices after the list (a value the list does not hold). */
  children?: ReactNode;
}) {
  return (
    <Select aria-label={label} className={className} value={value ?? ''} onChange={(e) => onChange(e.target.value)}>
      <option value="">{all}</option>
      {choices.map(([v, words]) => (
        <option key={v} value={v}>
          {words}
        </option>
      ))}
      {children}
    </Select>
  );
}
