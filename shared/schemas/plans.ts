import { z } from 'zod';
import { FunctionalClassSchema } from './segments';

export const PlanMethodSchema = z.enum(['exact', 'fast', 'ranking']);

export const PlanTargetsSchema = z.object({
  /** Lane-mile-weighted network PCI at or above this in every plan year. */
  minNetworkPci: z.number().min(0, 'must be 0 to 100').max(100, 'must be 0 to 100').nullable().default(null),
  /** No segment of the class below this PCI in any plan year. */
  classFloors: z
    .array(
      z.object({
        functionalClass: FunctionalClassSchema,
        minPci: z.number().min(0, 'must be 0 to 100').max(100, 'must be 0 to 100'),
      }),
    )
    .max(7)
    .default([]),
  /** Share of lane-miles at PCI 71 or more (Light wear or better) in every plan year, in percent. */
  goodOrBetterPct: z.number().min(0, 'must be 0 to 100 %').max(100, 'must be 0 to 100 %').nullable().default(null),
});
export type PlanTargetsInput = z.infer<typeof PlanTargetsSchema>;

export const MIX_POLICY_KINDS = ['thin_overlay', 'mill_and_overlay'] as const;
export const MixPolicySchema = z.object({
  kinds: z.array(z.enum(MIX_POLICY_KINDS)).min(1, 'name at least one kind of treatment').max(2),
  mixId: z.string().min(1).max(64),
  thicknessIn: z.number().positive('must be more than 0 in').max(12, 'must be 12 in or less'),
});

export const PlanSettingsSchema = z
  .object({
    startYear: z.number().int().min(2000).max(2100),
    horizonYears: z.number().int().min(1, 'must be 1 to 20 years').max(20, 'must be 1 to 20 years'),
    budgetMode: z.enum(['flat', 'escalating', 'custom']),
    /** Year-1 budget for flat and escalating modes, in base-year dollars. */
    annualBudget: z.number().min(0, 'cannot be negative').max(1e10).optional(),
    escalationPct: z.number().min(-50).max(50).default(0),
    /** One budget per year for the custom mode. */
    budgets: z.array(z.number().min(0, 'cannot be negative').max(1e10)).max(20).optional(),
    minNetworkPci: z.number().min(0).max(100).nullable().default(null),
    method: PlanMethodSchema.default('fast'),
    weighting: z.enum(['lane-miles', 'lane-miles-traffic']).default('lane-miles'),
    /** Treatments the plan may use; empty means all in the catalog. */
    treatmentIds: z.array(z.string()).max(50).default([]),
    needsWorkBelow: z.number().min(0).max(100).default(71),
    /** What the plan optimises: most benefit within the budgets, or least life-cycle cost meeting the targets. */
    objective: z.enum(['benefit', 'cost']).default('benefit'),
    targets: PlanTargetsSchema.default({ minNetworkPci: null, classFloors: [], goodOrBetterPct: null }),
    maxStrategiesPerSegment: z
      .number()
      .int('must be a whole number')
      .min(1, 'must be 1 to 200')
      .max(200, 'must be 1 to 200')
      .default(24),
    /** Replace the mix and lift of these treatment kinds across the plan. */
    mixPolicy: MixPolicySchema.nullable().default(null),
    /** Let a thin lift be planned where the AASHTO 1993 check flags the base (each such item says so). */
    allowThinOnWeakBase: z.boolean().default(false),
    /** Years past the horizon over which benefit is still counted (one window for every option). */
    benefitTailYears: z
      .number()
      .int('must be a whole number')
      .min(0, 'must be 0 to 30')
      .max(30, 'must be 0 to 30')
      .default(10),
  })
  .superRefine((s, ctx) => {
    if (
      s.objective === 'cost' &&
      s.targets.minNetworkPci === null &&
      s.minNetworkPci === null &&
      s.targets.classFloors.length === 0 &&
      s.targets.goodOrBetterPct === null
    )
      ctx.addIssue({
        code: 'custom',
        path: ['targets'],
        message: 'the least-cost objective needs at least one condition target',
      });
    const seen = new Set<string>();
    for (const [i, f] of s.targets.classFloors.entries()) {
      if (seen.has(f.functionalClass))
        ctx.addIssue({
          code: 'custom',
          path: ['targets', 'classFloors', i, 'functionalClass'],
          message: 'is listed twice',
        });
      seen.add(f.functionalClass);
    }
    if (s.budgetMode === 'custom') {
      if (!s.budgets) ctx.addIssue({ code: 'custom', path: ['budgets'], message: 'is required: one budget per year' });
      else if (s.budgets.length !== s.horizonYears)
        ctx.addIssue({ code: 'custom', path: ['budgets'], message: `needs ${s.horizonYears} values, one per year` });
    } else if (s.annualBudget === undefined) {
      ctx.addIssue({ code: 'custom', path: ['annualBudget'], message: 'is required' });
    }
  });
/** Settings as parsed, every default filled in. */
export type PlanSettingsParsed = z.infer<typeof PlanSettingsSchema>;
/** The settings added with treatment strategies: optional in this type, so plans saved before them still type-check. */
export type NewPlanSettingKeys =
  | 'objective'
  | 'targets'
  | 'maxStrategiesPerSegment'
  | 'mixPolicy'
  | 'allowThinOnWeakBase'
  | 'benefitTailYears';
export type PlanSettingsInput = Omit<PlanSettingsParsed, NewPlanSettingKeys> &
  Partial<Pick<PlanSettingsParsed, NewPlanSettingKeys>>;

export function budgetsOf(s: PlanSettingsInput): number[] {
  if (s.budgetMode === 'custom') return s.budgets ?? [];
  return Array.from(
    { length: s.horizonYears },
    (_, y) => (s.annualBudget ?? 0) * (s.budgetMode === 'escalating' ? (1 + s.escalationPct / 100) ** y : 1),
  );
}

export const PlanBodySchema = z.object({ name: z.string().trim().min(1).max(120), settings: PlanSettingsSchema });

export const PlanSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  status: z.enum(['draft', 'published']),
  settings: z.unknown(),
  createdAt: z.string(),
  updatedAt: z.string(),
  publishedAt: z.string().nullable(),
  lastRun: z
    .object({ id: z.string(), status: z.string(), startedAt: z.string(), endedAt: z.string().nullable() })
    .nullable(),
});

export const PlanParamsSchema = z.object({ agencyId: z.string().min(1).max(64), planId: z.string().min(1).max(64) });

export const PublishBodySchema = z.object({ publish: z.boolean(), notifyViewers: z.boolean().default(false) });
export const BudgetSearchBodySchema = z.object({ targetPci: z.number().min(1).max(100) });

// ---- The stateless optimiser (POST /api/plan/optimize) ----------------------

const OptionSchema = z
  .object({
    id: z.string().min(1).max(120),
    benefit: z.number().min(0).max(1e12),
    year: z.number().int().min(0).optional(),
    cost: z.number().min(0).max(1e12).optional(),
    /** Spending by plan year; a year listed twice counts both amounts (they are added up). */
    costs: z
      .array(z.object({ year: z.number().int().min(0), cost: z.number().min(0).max(1e12) }))
      .min(1)
      .max(20)
      .optional(),
  })
  .refine(
    (o) => (o.costs ? o.year === undefined && o.cost === undefined : o.year !== undefined && o.cost !== undefined),
    {
      message: 'give either year and cost, or costs: [{ year, cost }]',
    },
  );

export const OptimizeBodySchema = z
  .object({
    budgets: z.array(z.number().min(0, 'cannot be negative').max(1e12)).min(1, 'give at least one year').max(50),
    method: z.enum(['exact', 'fast', 'ranking']).default('fast'),
    segments: z
      .array(
        z.object({
          id: z.string().min(1).max(120),
          priority: z.number().optional(),
          options: z.array(OptionSchema).max(200),
        }),
      )
      .max(100_000),
    timeLimitSeconds: z.number().min(1).max(120).default(30),
  })
  .superRefine((b, ctx) => {
    // Segment ids name the answer's rows, and option ids within a segment name its choice: both unique.
    const seen = new Map<string, number>();
    for (const [i, s] of b.segments.entries()) {
      const first = seen.get(s.id);
      if (first !== undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['segments', i, 'id'],
          message: `repeats the id of segment ${first} ("${s.id}"); segment ids must be unique`,
        });
      else seen.set(s.id, i);
      const optionSeen = new Map<string, number>();
      for (const [j, o] of s.options.entries()) {
        const firstOption = optionSeen.get(o.id);
        if (firstOption !== undefined)
          ctx.addIssue({
            code: 'custom',
            path: ['segments', i, 'options', j, 'id'],
            message: `repeats the id of option ${firstOption} of this segment ("${o.id}"); option ids must be unique within a segment`,
          });
        else optionSeen.set(o.id, j);
      }
      for (const [j, o] of s.options.entries()) {
        const years = o.costs ? o.costs.map((c) => c.year) : [o.year ?? 0];
        if (years.some((y) => y >= b.budgets.length))
          ctx.addIssue({
            code: 'custom',
            path: ['segments', i, 'options', j],
            message: `spends in a year with no budget (there are ${b.budgets.length})`,
          });
      }
    }
  });
export type OptimizeBody = z.infer<typeof OptimizeBodySchema>;

export const OptimizeResultSchema = z.object({
  method: z.string(),
  chosen: z.array(z.object({ segmentId: z.string(), optionId: z.string() })),
  totalBenefit: z.number(),
  spentByYear: z.array(z.number()),
  /** HiGHS's dual bound (exact) or the Lagrangian bound (fast, worst-first) on the best total benefit. */
  bound: z.number(),
  gap: z.number(),
  status: z.string(),
  /** Rows the answer does not meet (none in this endpoint today: it takes no targets). */
  targetsMissed: z.array(z.string()),
});

// ---- Forecast (moved to ./forecast; these names stay for the plan module) ----

export { CurveOverrideBodySchema, CurveSchema } from './forecast';
export type { Family as FamilyView } from './forecast';

// ---- Plan versions and publishing (plan-screens) ------------------------------

/** A frozen, published version of a plan: its number, name, settings and the run it pins. */
export const PlanVersionSchema = z.object({
  id: z.string(),
  version: z.number().int(),
  name: z.string(),
  settings: z.unknown(),
  runId: z.string(),
  publishedAt: z.string(),
  publishedBy: z.string().nullable(),
  /** Viewers see this one now. */
  current: z.boolean(),
});

/** What the plan screen shows: the editable copy, which version it is, and what viewers see. */
export const PlanViewSchema = PlanSummarySchema.extend({
  /** The version number of what is shown (for viewers, the published one). */
  version: z.number().int(),
  /** True when the editable copy is a published version: the next change opens a new draft version. */
  frozen: z.boolean(),
  published: z.object({ id: z.string(), version: z.number().int(), publishedAt: z.string() }).nullable(),
  /** The latest finished run was started after the last change (null: never run). */
  resultCurrent: z.boolean().nullable(),
});

export const PlanVersionListSchema = z.object({
  /** The editable copy's version number, and whether it is a draft not yet published. */
  editing: z.object({ version: z.number().int(), draft: z.boolean() }),
  items: z.array(PlanVersionSchema),
});

/** Run the plan: the screen's unsaved name and settings, saved first when they differ. */
export const PlanRunBodySchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  settings: PlanSettingsSchema.optional(),
});

/** Publish the editable copy, or with `version` put an earlier published version back. */
export const PublishVersionBodySchema = PublishBodySchema.extend({
  version: z.number().int().min(1).optional(),
});

/** Which version's result, brief or work list (engineers; viewers always get the published one). */
export const PlanVersionQuerySchema = z.object({
  version: z.coerce.number().int().min(1).optional(),
});

/**
 * A dollar amount as people type it: "$250,000", "250k", "1.85M", "$1,850,000", "2.4 million".
 * Null when it is not an amount.
 */
export function parseDollars(text: string): number | null {
  const t = text
    .trim()
    .toLowerCase()
    .replace(/^\$\s*/, '')
    .replace(/,/g, '')
    .replace(/\s+/g, ' ');
  const m = /^(\d+(?:\.\d+)?|\.\d+)\s*(k|thousand|m|mm|million|b|billion)?$/.exec(t);
  if (!m) return null;
  const mult = { k: 1e3, thousand: 1e3, m: 1e6, mm: 1e6, million: 1e6, b: 1e9, billion: 1e9 }[m[2] ?? ''] ?? 1;
  return Math.round(Number(m[1]) * mult * 100) / 100;
}
