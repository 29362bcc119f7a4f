export const IMPORT_STEPS = ['Choose file', 'Match columns', 'Check', 'Write'];

export function ImportSteps({ step }: { step: number }) {
  return (
    <ol className="flex gap-2 text-sm" aria-label="Import steps">
      {IMPORT_STEPS.map((s, i) => (
        <li
          key={s}
          className={`rounded-full px-3 py-1 ${i === step ? 'bg-accent font-bold text-white' : i < step ? 'bg-accent-light text-accent' : 'bg-white text-asphalt-muted'}`}
          aria-current={i === step ? 'step' : undefined}
        >
          {i + 1}. {s}
        </li>
      ))}
    </ol>
  );
}
