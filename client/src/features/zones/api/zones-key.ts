export const zonesKey = ['zones'] as const;
