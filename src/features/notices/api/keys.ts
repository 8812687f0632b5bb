export const noticesKeys = {
  all: ['notices'] as const,
  unread: () => [...noticesKeys.all, 'unread'] as const,
  lists: () => [...noticesKeys.all, 'list'] as const,
  list: (page: number) => [...noticesKeys.lists(), page] as const,
};
