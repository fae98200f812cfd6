/** Where the read view links each processor block's computed curve for download. */
export function curveHrefFor(venueSlug: string, pageSlug: string): (n: number) => string {
  return (n) => `/venues/${encodeURIComponent(venueSlug)}/${encodeURIComponent(pageSlug)}/curves/${n}.txt`;
}
