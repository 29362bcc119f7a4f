import type { ReactNode } from 'react';

export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen">
      <div className="hidden w-[42%] flex-col justify-between bg-asphalt p-10 text-white md:flex">
        <div className="text-2xl font-black tracking-tight">Wearcourse</div>
        <div>
          <p className="max-w-sm text-lg leading-snug text-white/90">
            Road inventory, life-cycle cost and a paving budget plan you can defend before the council.
          </p>
          <div className="mt-6 flex h-2 w-64 overflow-hidden rounded" aria-hidden>
            {['#0f766e', '#4d9a7a', '#d6b25e', '#b45309', '#7f1d1d'].map((c) => (
              <div key={c} className="flex-1" style={{ background: c }} />
            ))}
          </div>
        </div>
        <div className="text-xs text-white/50">
          Planning estimates only; agency specifications and licensed engineering judgement govern.
        </div>
      </div>
      <div className="flex flex-1 items-center justify-center p-8">
        <div className="w-full max-w-sm">
          <h1 className="mb-6 text-2xl font-bold">{title}</h1>
          {children}
        </div>
      </div>
    </div>
  );
}

/** What went wrong with the form's request, under the form (nothing when all is well). */
export function AuthError({ error }: { error: Error | null }) {
  if (!error) return null;
  return (
    <p role="alert" className="text-sm text-band-failed">
      {error.message}
    </p>
  );
}
