import { createContext, type ReactNode, useCallback, useContext, useMemo, useState } from 'react';

type Help = { open: boolean; termId: string | null; show: (termId?: string) => void; close: () => void };

const HelpContext = createContext<Help | null>(null);

/** Holds whether the help panel is open and which term it shows; the rail and every Term open it. */
export function HelpProvider({ children }: { children: ReactNode }) {
  const [open, setOpen] = useState(false);
  const [termId, setTermId] = useState<string | null>(null);
  const show = useCallback((id?: string) => {
    setTermId(id ?? null);
    setOpen(true);
  }, []);
  const close = useCallback(() => setOpen(false), []);
  const value = useMemo(() => ({ open, termId, show, close }), [open, termId, show, close]);
  return <HelpContext.Provider value={value}>{children}</HelpContext.Provider>;
}

/** The help panel's controls, or null outside the app frame (the print brief, sign-in). */
export const useHelp = () => useContext(HelpContext);
