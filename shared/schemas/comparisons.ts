import { z } from 'zod';
import { EconomicsSchema, MixSchema, TreatmentSchema } from './catalog';
import { FunctionalClassSchema } from './segments';
import type { ComparisonResult } from '../engine/lcca/comparison';

// ---- The stateless evaluation (POST /api/lcca/evaluate) -------------------

export const ActivitySchema = z.object({
  year: z.number().int().min(0),
  cost: z.number().min(0).max(1e12),
  serviceLifeYears: z.number().positive('must be more than 0').max(100),
  label: z.string().max(120).optional(),
  userCost: z.number().min(0).max(1e12).optional(),
  salvage: z.boolean().optional(),
});

const RatesSchema = z.object({
  perSy: z.number().min(0).max(1e6).default(0),
  perLaneMile: z.number().min(0).max(1e9).default(0),
  perJob: z.number().min(0).max(1e9).default(0),
  addOnFraction: z.number().min(0).max(5).default(0),
});
const TemplateSchema = z.object({
  label: z.string().max(120),
  serviceLifeYears: z.number().positive().max(100),
  rates: RatesSchema,
  userCostPerJob: z.number().min(0).optional(),
});

export const ScheduleSchema = z.object({
  initial: TemplateSchema,
  rehabilitation: z.array(TemplateSchema).max(10).default([]),
  maintenance: z
    .array(z.object({ template: TemplateSchema, everyYears: z.number().int().min(1).max(50) }))
    .max(10)
    .default([]),
  repeatAtEndOfLife: z.boolean().default(true),
});

export const EvaluateAlternativeSchema = z
  .object({
    name: z.string().trim().min(1).max(80),
    activities: z.array(ActivitySchema).max(200).optional(),
    /** Richer form: a plan priced per SY / lane-mile / job, expanded over the period. */
    plan: ScheduleSchema.optional(),
  })
  .refine((a) => (a.activities?.length ?? 0) > 0 || a.plan, {
    message: 'an alternative needs at least one activity (or a plan)',
    path: ['activities'],
  });

export const EvaluateBodySchema = z
  .object({
    discountRate: z.number().gt(-1, 'must be more than −100 %').lt(1),
    analysisPeriodYears: z.number().int().min(1).max(100),
    alternatives: z.array(EvaluateAlternativeSchema).min(1).max(12),
    /** Group quantities for plans priced per unit. */
    quantities: z.object({ areaSy: z.number().min(0).max(1e9), laneMiles: z.number().min(0).max(1e6) }).optional(),
  })
  .superRefine((b, ctx) => {
    for (const [i, a] of b.alternatives.entries()) {
      for (const [j, act] of (a.activities ?? []).entries()) {
        if (act.year > b.analysisPeriodYears)
          ctx.addIssue({
            code: 'custom',
            path: ['alternatives', i, 'activities', j, 'year'],
            message: `falls outside the ${b.analysisPeriodYears}-year analysis period`,
          });
      }
    }
    if (b.alternatives.some((a) => a.plan) && !b.quantities)
      ctx.addIssue({
        code: 'custom',
        path: ['quantities'],
        message: 'is required when an alternative is given as a plan',
      });
  });
export type EvaluateBody = z.infer<typeof EvaluateBodySchema>;

export const CashFlowSchema = z.object({
  year: z.number(),
  cost: z.number(),
  userCost: z.number(),
  presentValue: z.number(),
  label: z.string().optional(),
});

export const EvaluateResultSchema = z.object({
  discountRate: z.number(),
  analysisPeriodYears: z.number(),
  alternatives: z.array(
    z.object({
      name: z.string(),
      presentValue: z.number(),
      presentValueOfCosts: z.number(),
      euac: z.number(),
      remainingServiceLifeValue: z.number(),
      presentValueOfRemainingLife: z.number(),
      cashFlows: z.array(CashFlowSchema),
    }),
  ),
});

// ---- Catalog-based analyses (saved under the agency) -----------------------

export const StepSchema = z.object({
  treatmentId: z.string().min(1).max(64),
  mixId: z.string().max(64).nullable().optional(),
  thicknessIn: z.number().positive().max(12).nullable().optional(),
  serviceLifeYears: z.number().positive().max(60).nullable().optional(),
});
export type Step = z.infer<typeof StepSchema>;

export const AlternativeSpecSchema = z.object({
  name: z.string().trim().min(1).max(80),
  initial: StepSchema,
  rehabilitation: z.array(StepSchema).max(6).default([]),
  maintenance: z
    .array(z.object({ treatmentId: z.string().min(1).max(64), everyYears: z.number().int().min(1).max(30) }))
    .max(4)
    .default([]),
  repeatAtEndOfLife: z.boolean().default(true),
});
export type AlternativeSpec = z.infer<typeof AlternativeSpecSchema>;

export const GroupSchema = z.object({
  label: z.string().max(200),
  segmentIds: z.array(z.number().int()).max(50_000).default([]),
  areaSy: z.number().positive().max(1e9),
  laneMiles: z.number().positive().max(1e6),
  centrelineMiles: z.number().positive().max(1e6),
  /** Per-segment traffic and condition for the structural caution. */
  segments: z
    .array(
      z.object({
        segmentId: z.string().max(60),
        adt: z.number().nullable(),
        truckPct: z.number().nullable(),
        functionalClass: FunctionalClassSchema,
        pci: z.number().nullable(),
        /** Centreline length, for the group's length-weighted PCI (older saved comparisons lack it). */
        lengthMi: z.number().min(0).max(1e4).optional(),
        /** Road name and limits, to show which roads a saved comparison holds. */
        name: z.string().max(200).optional(),
      }),
    )
    .max(50_000),
});
export type Group = z.infer<typeof GroupSchema>;

/**
 * The low and high of one uncertain input (keys as in the result's sensitivity
 * rows: rate, mix:<id>, treatment:<id>, alt:<i>:life:<j>). The range must hold
 * the value the comparison uses; the engine refuses one that does not, naming
 * the field (shared/engine/lcca/comparison.ts).
 */
export const RangeOverrideSchema = z
  .object({
    low: z.number(),
    high: z.number(),
    distribution: z.enum(['triangular', 'uniform', 'fixed']).default('triangular'),
  })
  .refine((r) => r.low <= r.high, { message: 'low is above high', path: ['low'] });

export const ComparisonInputSchema = z.object({
  economics: EconomicsSchema,
  group: GroupSchema,
  alternatives: z
    .array(AlternativeSpecSchema)
    .min(2, 'compare at least two alternatives')
    .max(6, 'compare at most six alternatives'),
  baselineIndex: z.number().int().min(0).default(0),
  risk: z.object({
    iterations: z.number().int().min(100).max(20_000).default(5000),
    seed: z
      .number()
      .int()
      .min(0)
      .max(2 ** 31)
      .default(2027),
    ranges: z
      .record(z.string().max(120), RangeOverrideSchema)
      .refine((r) => Object.keys(r).length <= 100, 'at most 100 ranges')
      .default({}),
  }),
  /** The catalog items the study uses, as they were: the snapshot that makes a re-run exact. */
  catalog: z.object({ mixes: z.array(MixSchema), treatments: z.array(TreatmentSchema) }),
});
export type ComparisonInput = z.infer<typeof ComparisonInputSchema>;

/** What the client sends: the catalog snapshot and economics are filled in by the server. */
export const ComparisonRequestSchema = z.object({
  name: z.string().trim().min(1).max(120).default('Untitled comparison'),
  group: GroupSchema,
  alternatives: ComparisonInputSchema.shape.alternatives,
  baselineIndex: z.number().int().min(0).default(0),
  risk: ComparisonInputSchema.shape.risk.default({ iterations: 5000, seed: 2027, ranges: {} }),
  economics: EconomicsSchema.partial().optional(),
});
export type ComparisonRequest = z.infer<typeof ComparisonRequestSchema>;

export const ComparisonParamsSchema = z.object({
  agencyId: z.string().min(1).max(64),
  analysisId: z.string().min(1).max(64),
});

export const SaveComparisonBodySchema = z.object({
  name: z.string().trim().min(1).max(120),
  runId: z.string().min(1).max(64),
});

export const ComparisonListSchema = z.object({
  items: z.array(
    z.object({
      id: z.string(),
      name: z.string(),
      createdAt: z.string(),
      updatedAt: z.string(),
      createdBy: z.string().nullable(),
      alternatives: z.number(),
      group: z.string(),
      laneMiles: z.number(),
    }),
  ),
});

export const SavedComparisonSchema = z.object({ id: z.string() });

/** A saved comparison: its input snapshot and, once run, its result (shared/engine/lcca/comparison.ts). */
export const ComparisonSchema = z.object({
  id: z.string(),
  name: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
  input: ComparisonInputSchema,
  // The result's type comes from the engine; the document describes it as an object.
  result: z
    .custom<ComparisonResult>()
    .meta({
      type: 'object',
      description: 'null until run: per alternative the costs, EUAC, cash flows, the risk run and the cautions',
    })
    .nullable(),
});
