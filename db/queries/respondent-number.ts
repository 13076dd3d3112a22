/**
 * A respondent's number within their study: the 1-based position in order of starting, ties by
 * id, counting the tombstones of erased respondents too, so that erasing one respondent never
 * renumbers the others. For selects from the `respondents` table (not aliased).
 * Tenant: a fragment inside selects that filter on the study themselves; it correlates on the
 * row's own study.
 */
import { sql, type SQL } from 'drizzle-orm';

// Qualified by hand: drizzle leaves the columns of a one-table select unqualified, and inside
// the subquery an unqualified study_id would name r2's own column.
export const respondentNumber: SQL<number> = sql<number>`((select count(*)::int from respondents r2
    where r2.study_id = "respondents"."study_id"
      and (r2.started_at, r2.id) <= ("respondents"."started_at", "respondents"."id"))
  + (select count(*)::int from respondent_tombstones t2
    where t2.study_id = "respondents"."study_id"
      and (t2.started_at, t2.id) <= ("respondents"."started_at", "respondents"."id")))`;
