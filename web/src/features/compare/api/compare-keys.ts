export const compareKeys = {
  all: ['compare'] as const,
  housePart: (housePartId: number) => [...compareKeys.all, housePartId] as const,
};
