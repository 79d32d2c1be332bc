/** Query keys of the refits screen. */
export const modelsPrefix = ['models'] as const;
export const refitJobsKey = ['models', 'refits'] as const;
export const modelVersionsPrefix = ['models', 'versions'] as const;

export function modelVersionsKey(zone: string) {
  return [...modelVersionsPrefix, { zone }] as const;
}

export function modelCompareKey(id: number) {
  return ['models', 'compare', id] as const;
}
