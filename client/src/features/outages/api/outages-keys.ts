export const outagesPrefix = ['outages'] as const;

export function outagesKey(zone: string | null) {
  return [...outagesPrefix, { zone }] as const;
}
