import { matchTimeZones, timeZones, zoneOffset } from './time-zones';

describe('time zones', () => {
  it('should list UTC first and then the browser’s IANA zones', () => {
    const zones = timeZones();
    expect(zones[0]).toBe('UTC');
    expect(zones).toContain('Pacific/Fiji');
    expect(zones.filter((zone) => zone === 'UTC').length).toBe(1);
  });

  it('should find a zone by words in any order, underscores read as spaces', () => {
    const zones = ['Pacific/Port_Moresby', 'Pacific/Fiji', 'America/Port_of_Spain'];
    expect(matchTimeZones(zones, 'moresby port')).toEqual(['Pacific/Port_Moresby']);
    expect(matchTimeZones(zones, 'PACIFIC')).toEqual(['Pacific/Port_Moresby', 'Pacific/Fiji']);
  });

  it('should cap the list shown', () => {
    expect(matchTimeZones(timeZones(), '', 10).length).toBe(10);
  });

  it('should say a zone’s offset from UTC', () => {
    // Tokyo keeps no daylight saving: always nine hours ahead (IANA tz database).
    expect(zoneOffset('Asia/Tokyo')).toBe('UTC+09:00');
    expect(zoneOffset('UTC')).toBe('UTC+00:00');
    expect(zoneOffset('Not/AZone')).toBeNull();
  });
});
