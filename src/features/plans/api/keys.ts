import type { AnyPlanResult } from '@shared/plan-headline';
import type { PlanSettingsInput } from '@shared/schemas/plans';

// Keys go from general to specific: everything of one agency's plans invalidates with plansKeys.all.
export const plansKeys = {
  all: (agencyId: string) => ['plans', agencyId] as const,
  list: (agencyId: string) => ['plans', agencyId, 'list'] as const,
  detail: (agencyId: string, planId: string) => ['plans', agencyId, 'detail', planId] as const,
  result: (agencyId: string, planId: string, version?: number) =>
    ['plans', agencyId, 'result', planId, version ?? 'latest'] as const,
  versions: (agencyId: string, planId: string) => ['plans', agencyId, 'versions', planId] as const,
};

export const plansPath = (agencyId: string) => `/api/agencies/${agencyId}/plans`;

/** The settings as this screen edits them: the contract's new fields are optional until every plan has them. */
export type PlanSettings = PlanSettingsInput & {
  mixPolicy?: { kinds: ('thin_overlay' | 'mill_and_overlay')[]; mixId: string; thicknessIn: number } | null;
};

export type PlanSummary = {
  id: string;
  name: string;
  status: 'draft' | 'published';
  settings: PlanSettings;
  createdAt: string;
  updatedAt: string;
  publishedAt: string | null;
  lastRun: { id: string; status: string; startedAt: string; endedAt: string | null } | null;
  /** Old servers leave these out; the screens read them with defaults. */
  version?: number;
  frozen?: boolean;
  published?: { id: string; version: number; publishedAt: string } | null;
  resultCurrent?: boolean | null;
};

export type StoredResult = AnyPlanResult;
