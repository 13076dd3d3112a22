/**
 * Viewers see coarse device classes, never a user agent: what is stored for a respondent and
 * what the responses table shows is one of phone, tablet, desktop or unknown. User-agent
 * strings below are common browsers' published formats (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { deviceClasses, toDeviceClass } from '../../../server/lib/device-class';

const iphone =
  'Mozilla/5.0 (iPhone; CPU iPhone OS 17_1 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.1 Mobile/15E148 Safari/604.1';
const ipad =
  'Mozilla/5.0 (iPad; CPU OS 16_6 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/16.6 Mobile/15E148 Safari/604.1';
const linux = 'Mozilla/5.0 (X11; Linux x86_64; rv:120.0) Gecko/20100101 Firefox/120.0';

describe('toDeviceClass', () => {
  it.each([
    [iphone, 'phone'],
    [ipad, 'tablet'],
    [linux, 'desktop'],
    ['', 'unknown'],
    [undefined, 'unknown'],
    ['curl/8.4.0 (one-off client; build 7f3a)', 'unknown'],
  ])('reads %j as %s', (ua, want) => {
    expect(toDeviceClass(ua)).toBe(want);
  });

  it('passes a class through, so classes stored by the demo or earlier stay classes', () => {
    for (const c of deviceClasses) expect(toDeviceClass(c)).toBe(c);
  });

  it('never returns anything of the raw string', () => {
    for (const ua of [iphone, ipad, linux, 'Secret-Kiosk-Build-1234'])
      expect(deviceClasses).toContain(toDeviceClass(ua));
  });
});
