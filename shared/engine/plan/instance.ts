// The optimiser's input, packed in typed arrays (docs/COMPUTATION.md, the budget plan).
// The strategy generator writes it; the exact, fast and worst-first methods read it.
// Each segment chooses at most one of its strategies, or does nothing (implicit,
// never listed), unless `mustChoose` says do-nothing breaks a hard condition rule.

/** A linear condition target, one row: Σ gain[k]·x[idx[k]] ≥ rhs (sparse over options). */
export type TargetRow = {
  /** Plain words for reports: "network PCI ≥ 65 in 2029", "principal arterials in good or better ≥ 80 % in 2031". */
  label: string;
  /** Plan year (0-based) the row concerns. */
  year: number;
  rhs: number;
  idx: Int32Array;
  gain: Float64Array;
};

export type PackedInstance = {
  /** Number of plan years Y. */
  years: number;
  /** Budget per plan year, base-year dollars (length Y). */
  budgets: Float64Array;
  nSegments: number;
  /** Options of segment i are the indices segStart[i] … segStart[i+1]−1 (length nSegments + 1). */
  segStart: Int32Array;
  /** Benefit of each option over do-nothing, ≥ 0 (objective "benefit"). */
  benefit: Float64Array;
  /** Agency life-cycle cost (NPV, RSL credited) of each option less that of do-nothing (objective "cost"). */
  lcc: Float64Array;
  /** Spending by plan year: cost[o·Y + y] (length nOptions·Y). */
  cost: Float64Array;
  /** Worst-first order key per segment (lower is treated first): today's PCI. */
  priority: Float64Array;
  /** 1 where doing nothing breaks a hard rule (e.g. a class floor), so the segment must take an option. */
  mustChoose: Uint8Array;
  targets: TargetRow[];
  objective: 'benefit' | 'cost';
};

export type PlanSolution = {
  method: 'exact' | 'fast' | 'ranking';
  /** Chosen option index per segment, −1 for do-nothing. */
  pick: Int32Array;
  /** Objective value: total benefit (maximised) or total life-cycle cost over do-nothing (minimised). */
  objective: number;
  /** A proven bound on the optimum (upper for benefit, lower for cost), from HiGHS or the Lagrangian dual. */
  bound: number;
  /** |bound − objective| / max(|bound|, tiny). */
  gap: number;
  spentByYear: Float64Array;
  /** Labels of target rows the solution does not meet (the fast and worst-first methods say so; exact meets them or fails). */
  targetsMissed: string[];
  status: string;
};

export const optionCount = (inst: PackedInstance) => inst.segStart[inst.nSegments];
