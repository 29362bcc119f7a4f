// The network summary's query key: segment, survey and import writes invalidate it.
export const networkKeys = {
  all: (agencyId: string) => ['network', agencyId] as const,
  summary: (agencyId: string) => networkKeys.all(agencyId),
};
