/**
 * Outage and bad-data windows: hours of a zone that do not count as normal load. They are
 * excluded from model training (treated as missing) and shown as such on charts.
 */
export const OUTAGE_KINDS = ['outage', 'bad-data'] as const;
export type OutageKind = (typeof OUTAGE_KINDS)[number];

export interface OutageDto {
  id: number;
  zone: string;
  kind: OutageKind;
  /** UTC hour start of the first excluded hour. */
  start: string;
  /** UTC end (exclusive, on the hour); null while the window is still open. */
  end: string | null;
  note: string;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
  closedAt: string | null;
  closedBy: string | null;
}

/** POST /api/outages — start and end are rounded out to whole hours. */
export interface CreateOutageRequest {
  zone: string;
  kind: OutageKind;
  start: string;
  end?: string | null;
  note: string;
}

/** PATCH /api/outages/:id — what changes, and why. */
export interface UpdateOutageRequest {
  kind?: OutageKind;
  start?: string;
  end?: string | null;
  note?: string;
  reason: string;
}

/** POST /api/outages/:id/close — ends an open window (default: the end of the current hour). */
export interface CloseOutageRequest {
  end?: string;
  reason?: string;
}
