// The agency settings' query key.
export const settingsKeys = {
  agency: (agencyId: string) => ['agency-settings', agencyId] as const,
};

export const settingsPath = (agencyId: string) => `/api/agencies/${agencyId}/settings`;
