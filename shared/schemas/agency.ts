import { z } from 'zod';

export const AgencySettingsSchema = z.object({
  name: z.string().trim().min(2, 'needs at least 2 characters').max(120),
  units: z.enum(['us', 'metric']),
});
export type AgencySettings = z.infer<typeof AgencySettingsSchema>;
