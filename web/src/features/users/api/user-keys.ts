export const userKeys = {
  all: ['users'] as const,
  lists: () => [...userKeys.all, 'list'] as const,
  invitations: () => [...userKeys.all, 'invitations'] as const,
};
