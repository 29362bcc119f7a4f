// Every members query key: the members with pending invitations, and the mail the catcher kept.
export const memberKeys = {
  list: (agencyId: string) => ['members', agencyId] as const,
  sentMail: (agencyId: string) => ['sent-mail', agencyId] as const,
};
