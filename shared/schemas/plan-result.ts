// The stored result of a plan run (shared/engine/plan/run-plan.ts runPlan), as the screens and
// exports read it. Fields added with treatment strategies are marked; older stored results lack them.
import { z } from 'zod';

const tons = z.record(z.string(), z.number());

export const PlanWorkItemSchema = z.object({
  year: z.number().int(),
  calendarYear: z.number().int(),
  ref: z.number().int(),
  segmentId: z.string(),
  roadName: z.string(),
  fromDesc: z.string().nullable(),
  toDesc: z.string().nullable(),
  functionalClass: z.string(),
  treatment: z.string(),
  mix: z.string().nullable(),
  thicknessIn: z.number().nullable(),
  tons: z.number(),
  areaSy: z.number(),
  laneMiles: z.number(),
  cost: z.number(),
  pciBefore: z.number(),
  pciAfter: z.number(),
  /** The segment's whole strategy in plain words: "crack seal 2027, thin overlay 2031". */
  strategy: z.string(),
  /** Plain-words caution from the AASHTO 1993 structural check, or null. */
  structuralFlag: z.string().nullable(),
});

export const PlanYearSchema = z.object({
  year: z.number().int(),
  calendarYear: z.number().int(),
  budget: z.number(),
  spent: z.number(),
  networkPci: z.number(),
  networkPciDoNothing: z.number(),
  laneMilesByBand: z.record(z.string(), z.number()),
  backlog: z.number(),
  backlogNoFit: z.object({ segments: z.number().int(), laneMiles: z.number() }),
  failedLaneMiles: z.number(),
  tonsByMix: tons,
});

export const PlanResultSchema = z.object({
  planName: z.string(),
  method: z.enum(['exact', 'fast', 'ranking']),
  candidates: z.object({ segments: z.number().int(), options: z.number().int() }),
  solution: z.object({
    totalBenefit: z.number(),
    bound: z.number(),
    gap: z.number(),
    status: z.string(),
    objective: z.enum(['benefit', 'cost']),
    /** Total benefit, or total life-cycle cost over do-nothing, of the chosen strategies. */
    objectiveValue: z.number(),
    targetsMissed: z.array(z.string()),
    mixPolicy: z.object({ mixName: z.string(), thicknessIn: z.number() }).nullable(),
  }),
  baseline: z.object({
    totalBenefit: z.number(),
    finalPci: z.number(),
    years: z.array(z.object({ calendarYear: z.number().int(), networkPci: z.number(), spent: z.number() })),
  }),
  years: z.array(PlanYearSchema),
  work: z.array(PlanWorkItemSchema),
  summary: z.object({
    startPci: z.number(),
    finalPci: z.number(),
    finalPciDoNothing: z.number(),
    totalSpent: z.number(),
    totalBudget: z.number(),
    backlogStart: z.number(),
    backlogEnd: z.number(),
    laneMiles: z.number(),
    segmentsTreated: z.number().int(),
    workItems: z.number().int(),
    lifeCycleCost: z.number(),
    failedLaneMilesStart: z.number(),
    failedLaneMilesEnd: z.number(),
    tonsByMix: tons,
  }),
  minNetworkPci: z.number().nullable(),
  floorMissedIn: z.array(z.number().int()),
});
export type PlanResultShape = z.infer<typeof PlanResultSchema>;

/** `GET …/plans/:planId/result`: the latest finished run's result (results stored by older versions may lack newer fields). */
export const PlanLatestResultSchema = z.object({
  latest: z
    .object({
      runId: z.string(),
      endedAt: z.string().nullable(),
      version: z.number().int().nullable(),
      result: PlanResultSchema,
    })
    .nullable(),
});
