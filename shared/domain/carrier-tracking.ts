// The carrier's own public tracking page for a shipment. Which carriers a factory uses, and where
// their tracking pages are, is the factory's own data (settings key `carriers`): each entry is a
// name as people type it and an https address with `{number}` where the tracking number goes.

export interface CarrierLink {
  /** the carrier's name; a shipment's carrier matches when it starts with it (case does not count) */
  name: string;
  /** https address of the public tracking page, `{number}` standing for the tracking number */
  trackingUrl: string;
}

/** The public tracking page of this shipment, or null when the carrier is not among `carriers`. */
export function carrierTrackingUrl(carrier: string, trackingNumber: string, carriers: readonly CarrierLink[]): string | null {
  const number = trackingNumber.trim();
  // tracking numbers are letters, digits and dashes (see normaliseTrackingNumber); anything else gets no link
  if (!/^[A-Za-z0-9-]{4,40}$/.test(number)) return null;
  const typed = carrier.trim().toLowerCase();
  const known = carriers.find(
    (c) => c.name.trim() !== '' && typed.startsWith(c.name.trim().toLowerCase()) && c.trackingUrl.startsWith('https://') && c.trackingUrl.includes('{number}'),
  );
  return known ? known.trackingUrl.replace('{number}', encodeURIComponent(number)) : null;
}
