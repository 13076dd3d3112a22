/**
 * The query string of a request, `?a=1&b=x`, or '' when nothing is set. Undefined and empty
 * values are left out, so a cleared filter sends nothing rather than an empty parameter.
 */
export function searchString(
  params: Record<string, string | number | boolean | undefined>,
): string {
  const s = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== '') s.set(k, String(v));
  const qs = s.toString();
  return qs ? `?${qs}` : '';
}
