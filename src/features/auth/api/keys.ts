/** Query keys for the auth feature: `['auth']`, `['auth', 'detail', id]`. */
export const authKeys = {
  all: ['auth'] as const,
  details: () => [...authKeys.all, 'detail'] as const,
  detail: (id: string) => [...authKeys.details(), id] as const,
  session: () => authKeys.detail('session'),
  invitePreview: (token: string) => authKeys.detail(`invite-preview:${token}`),
  passwordResetCheck: (token: string) => authKeys.detail(`password-reset-check:${token}`),
};
