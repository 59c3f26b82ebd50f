/** The current time as an ISO 8601 string (UTC), for provenance records. */
export function isoNow(): string {
  return new Date().toISOString();
}
