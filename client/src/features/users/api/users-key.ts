export const usersKey = ['users'] as const;
