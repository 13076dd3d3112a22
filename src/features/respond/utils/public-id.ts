/** The public id in a respondent link's path (/s/:publicId), or '' when there is none. */
export function publicIdFromPath(pathname: string): string {
  return decodeURIComponent(/^\/s\/([^/?#]+)/.exec(pathname)?.[1] ?? '');
}
