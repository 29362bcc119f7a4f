// Every auth query key: the signed-in user (with their agencies) and an invitation by its token.
export const authKeys = {
  me: () => ['me'] as const,
  invitation: (token: string) => ['invitations', token] as const,
};
