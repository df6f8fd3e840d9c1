// Carrier tracking pages come from the factory's own list of carriers (invented ones here): a
// carrier on the list gets its page with the number in it, however its name is typed; any other
// carrier, an odd number or an address that is not https gets none.
import { describe, expect, it } from 'vitest';
import { carrierTrackingUrl, type CarrierLink } from './carrier-tracking';

const CARRIERS: CarrierLink[] = [
  { name: 'Swiftlane', trackingUrl: 'https://track.swiftlane.example/parcel/{number}' },
  { name: 'Harbourline Express', trackingUrl: 'https://harbourline.example/track?id={number}' },
  { name: 'Plainhttp Post', trackingUrl: 'http://plainhttp.example/{number}' },
];

describe('carrier tracking links', () => {
  it('a carrier on the factory list, however it is typed, links to its tracking page with the number', () => {
    expect(carrierTrackingUrl('Swiftlane Couriers', 'SL1234567890', CARRIERS)).toBe('https://track.swiftlane.example/parcel/SL1234567890');
    expect(carrierTrackingUrl('  harbourline express ', 'HX-2288-0041', CARRIERS)).toBe('https://harbourline.example/track?id=HX-2288-0041');
  });

  it('an unknown carrier, an odd number or an address that is not https gets no link', () => {
    expect(carrierTrackingUrl('Invented Parcel Co', 'IPC-2288-0041', CARRIERS)).toBeNull();
    expect(carrierTrackingUrl('Swiftlane', 'abc"><script>', CARRIERS)).toBeNull();
    expect(carrierTrackingUrl('Swiftlane', '12', CARRIERS)).toBeNull();
    expect(carrierTrackingUrl('Plainhttp Post', 'PP12345678', CARRIERS)).toBeNull();
    expect(carrierTrackingUrl('Swiftlane', 'SL1234567890', [])).toBeNull();
  });
});
