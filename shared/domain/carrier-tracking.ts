// The carrier's own public tracking page for a shipment, when we know the carrier by its name.
// The addresses are the carriers' public tracking pages as they were when written (from memory;
// a carrier that moves its page only loses the link, the number is always shown as text).

interface KnownCarrier {
  /** matches the carrier as people type it */
  names: RegExp;
  url: (trackingNumber: string) => string;
}

const KNOWN: KnownCarrier[] = [
  { names: /^dhl\b/i, url: (n) => `https://www.dhl.com/global-en/home/tracking/tracking-express.html?submit=1&tracking-id=${n}` },
  { names: /^ups\b|^united parcel/i, url: (n) => `https://www.ups.com/track?tracknum=${n}` },
  { names: /^fedex\b|^federal express/i, url: (n) => `https://www.fedex.com/fedextrack/?trknbr=${n}` },
  { names: /^usps\b|^us postal|^united states postal/i, url: (n) => `https://tools.usps.com/go/TrackConfirmAction?tLabels=${n}` },
  { names: /^royal mail\b/i, url: (n) => `https://www.royalmail.com/track-your-item#/tracking-results/${n}` },
  { names: /^sf\b|^sf express|^顺丰/i, url: (n) => `https://www.sf-express.com/chn/en/waybill/waybill-detail/${n}` },
];

/** The public tracking page of this shipment, or null when the carrier is not one we know. */
export function carrierTrackingUrl(carrier: string, trackingNumber: string): string | null {
  const number = trackingNumber.trim();
  // tracking numbers are letters, digits and dashes (see normaliseTrackingNumber); anything else gets no link
  if (!/^[A-Za-z0-9-]{4,40}$/.test(number)) return null;
  const known = KNOWN.find((k) => k.names.test(carrier.trim()));
  return known ? known.url(encodeURIComponent(number)) : null;
}
