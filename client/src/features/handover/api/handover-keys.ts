/** Query keys of the shift log; everything under `handoverKey` is refreshed after a write. */
export const handoverKey = ['handover'] as const;

export interface HandoverSearch {
  q?: string;
  zone?: string;
  /** yyyy-mm-dd, local day; inclusive. */
  from?: string;
  /** yyyy-mm-dd, local day; inclusive. */
  to?: string;
  limit: number;
  offset: number;
}

export const handoverKeys = {
  shift: [...handoverKey, 'shift'] as const,
  draft: [...handoverKey, 'draft'] as const,
  pending: [...handoverKey, 'pending'] as const,
  search: (search: HandoverSearch) => [...handoverKey, 'search', search] as const,
  note: (id: number) => [...handoverKey, 'note', id] as const,
};
