/**
 * What the product keeps of a user agent: a coarse device class for respondents, and a short
 * browser-and-system description for a researcher's own sessions list. The raw string, which
 * can single a person out, is never stored. Parsing by bowser (a maintained UA parser).
 */
import Bowser from 'bowser';

export const deviceClasses = ['phone', 'tablet', 'desktop', 'unknown'] as const;
export type DeviceClass = (typeof deviceClasses)[number];

function parse(userAgent: string | undefined) {
  const ua = (userAgent ?? '').slice(0, 500);
  return ua.trim() === '' ? null : Bowser.getParser(ua);
}

/** A panel launch brings the same few user agents again and again: parse each once. */
const classOfAgent = new Map<string, DeviceClass>();
const AGENTS_KEPT = 1_000;

export function getDeviceClass(userAgent: string | undefined): DeviceClass {
  const ua = userAgent ?? '';
  const known = classOfAgent.get(ua);
  if (known) return known;
  const found = classOf(userAgent);
  if (classOfAgent.size >= AGENTS_KEPT) classOfAgent.clear();
  classOfAgent.set(ua, found);
  return found;
}

function classOf(userAgent: string | undefined): DeviceClass {
  const p = parse(userAgent);
  switch (p?.getPlatformType(true)) {
    case 'mobile':
      return 'phone';
    case 'tablet':
      return 'tablet';
    case 'desktop':
      return 'desktop';
    default:
      return 'unknown';
  }
}

/**
 * The device class kept for a respondent: a class passes through, anything else is read as a
 * user agent. Also applied when reading, so rows stored before classes were kept show a class.
 */
export function toDeviceClass(value: string | undefined | null): DeviceClass {
  const v = (value ?? '').trim();
  return (deviceClasses as readonly string[]).includes(v)
    ? (v as DeviceClass)
    : getDeviceClass(v || undefined);
}

/** e.g. "Firefox on Linux (desktop)"; "Unknown device" when nothing is recognised. */
export function describeDevice(userAgent: string | undefined): string {
  const p = parse(userAgent);
  if (!p) return 'Unknown device';
  const browser = p.getBrowserName() || 'Unknown browser';
  const os = p.getOSName() || 'unknown system';
  const cls = getDeviceClass(userAgent);
  return `${browser} on ${os}${cls === 'unknown' ? '' : ` (${cls})`}`.slice(0, 100);
}
