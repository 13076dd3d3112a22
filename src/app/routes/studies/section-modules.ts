/**
 * The study sections that exist as route modules. A section is built by adding
 * `src/app/routes/studies/sections/<section>.tsx` (exporting `Component`, optionally `loader`);
 * the router registers it under the study layout and the pipeline links to it. Sections
 * without a module are shown in the pipeline but disabled.
 */
import type { LazyRouteFunction, RouteObject } from 'react-router';
import { studySections, type StudySection } from '@/config/paths';

const modules = import.meta.glob('./sections/*.tsx') as Record<
  string,
  () => Promise<Record<string, unknown>>
>;

const moduleOf = (section: StudySection) => modules[`./sections/${section}.tsx`];

export const builtSections: ReadonlySet<StudySection> = new Set(
  studySections.filter((s) => moduleOf(s) !== undefined),
);

export function getSectionRoutes(): RouteObject[] {
  return studySections
    .filter((s) => builtSections.has(s))
    .map((s) => ({
      path: s,
      lazy: moduleOf(s) as unknown as LazyRouteFunction<RouteObject>,
    }));
}
