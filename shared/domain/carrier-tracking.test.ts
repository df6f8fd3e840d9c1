// Carrier tracking pages: the addresses are the carriers' public pages (from memory); the checks
// are that a known carrier gets its page with the number in it, an unknown one none.
import { describe, expect, it } from 'vitest';
import { carrierTrackingUrl } from './carrier-tracking';

describe('carrier tracking links', () => {
  it('known carriers, however they are typed, link to their own tracking page with the number', () => {
    expect(carrierTrackingUrl('DHL Express', '1234567890')).toBe(
      'https://www.dhl.com/global-en/home/tracking/tracking-express.html?submit=1&tracking-id=1234567890',
    );
    expect(carrierTrackingUrl('ups', '1Z999AA10123456784')).toBe('https://www.ups.com/track?tracknum=1Z999AA10123456784');
    expect(carrierTrackingUrl('FedEx Ground', '449044304137821')).toContain('trknbr=449044304137821');
    expect(carrierTrackingUrl('顺丰速运', 'SF1234567890')).toContain('SF1234567890');
    for (const url of [carrierTrackingUrl('Royal Mail', 'AB123456789GB'), carrierTrackingUrl('USPS', '9400100000000000000000')])
      expect(url).toMatch(/^https:\/\//);
  });

  it('an unknown carrier or an odd number gets no link', () => {
    expect(carrierTrackingUrl('Invented Parcel Co', 'IPC-2288-0041')).toBeNull();
    expect(carrierTrackingUrl('DHL', 'abc"><script>')).toBeNull();
    expect(carrierTrackingUrl('DHL', '12')).toBeNull();
  });
});
