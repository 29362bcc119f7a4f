// HiGHS (WebAssembly), loaded once per worker thread and only when the exact method is asked for.
import loadHighs from 'highs';
import type { Highs } from '../../shared/engine/plan/solve';

let highs: Promise<Highs> | null = null;
export const loadSolver = () => (highs ??= loadHighs());
