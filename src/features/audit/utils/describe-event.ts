/** One audit event in plain words for the owner's table. */
import type { AuditEvent } from '@shared/schemas/audit';

const d = (e: AuditEvent, key: string) => {
  const v = e.details[key];
  return v === undefined || v === null ? '' : String(v);
};

/** A list of language tags in the details ('' when empty or absent). */
const list = (e: AuditEvent, key: string) => {
  const v = e.details[key];
  return Array.isArray(v) ? v.join(', ') : '';
};

export function describeAuditEvent(e: AuditEvent): string {
  switch (e.action) {
    case 'auth.sign_in':
      return 'Signed in';
    case 'auth.sign_in_failed':
      return 'Failed sign-in (wrong password)';
    case 'auth.email_confirmed':
      return 'Confirmed their e-mail address';
    case 'auth.password_changed':
      return `Changed their password (${d(e, 'otherSessionsEnded')} other sessions ended)`;
    case 'auth.password_reset':
      return 'Reset their password by e-mail link';
    case 'auth.sessions_revoked':
      return `Signed out everywhere (${d(e, 'sessionsEnded')} sessions)`;
    case 'auth.second_step_failed':
      return 'Failed sign-in (wrong two-step code)';
    case 'auth.two_step_enabled':
      return `Turned on two-step sign-in (${d(e, 'otherSessionsEnded')} other sessions ended)`;
    case 'auth.two_step_disabled':
      return 'Turned off two-step sign-in';
    case 'auth.recovery_codes_renewed':
      return 'Made new recovery codes for two-step sign-in';
    case 'member.joined':
      return `Joined the team as ${d(e, 'role')}`;
    case 'member.role_changed':
      return `Changed a member's role from ${d(e, 'from')} to ${d(e, 'to')}`;
    case 'member.removed':
      return `Removed a member (${d(e, 'role')}); their sessions ended`;
    case 'invitation.created':
      return `Invited someone as ${d(e, 'role')}`;
    case 'invitation.cancelled':
      return 'Cancelled an invitation';
    case 'study.went_live':
      return `Put study "${d(e, 'study')}" live (version ${d(e, 'version')})`;
    case 'study.reopened':
      return `Reopened study "${d(e, 'study')}" (version ${d(e, 'version')})`;
    case 'study.closed':
      return `Closed study "${d(e, 'study')}"${d(e, 'reason') && d(e, 'reason') !== 'manual' ? ` (${d(e, 'reason')})` : ''}`;
    case 'study.returned_to_draft':
      return `Returned study "${d(e, 'study')}" to draft`;
    case 'study.languages_changed':
      return `Changed the languages of study "${d(e, 'study')}" to ${list(e, 'languages')}${list(e, 'added') ? ` (added ${list(e, 'added')})` : ''}${list(e, 'removed') ? ` (removed ${list(e, 'removed')}; its texts deleted)` : ''}`;
    case 'study.translations_saved':
      return `Saved ${d(e, 'saved')} ${d(e, 'language')} texts of study "${d(e, 'study')}"${Number(d(e, 'removed')) > 0 ? ` and removed ${d(e, 'removed')}` : ''}`;
    case 'study.translations_imported':
      return `Imported ${d(e, 'imported')} ${d(e, 'language')} texts into study "${d(e, 'study')}" from a file (${d(e, 'format').toUpperCase()}; ${d(e, 'missing')} still missing, ${d(e, 'extra')} unknown left out)`;
    case 'study.translations_confirmed':
      return `Confirmed ${d(e, 'texts')} ${d(e, 'language')} texts of study "${d(e, 'study')}" as still right after their source changed`;
    case 'respondent.excluded':
      return `Excluded respondent ${d(e, 'respondent')}${d(e, 'reason') ? `: ${d(e, 'reason')}` : ''}`;
    case 'respondent.included':
      return `Included respondent ${d(e, 'respondent')} again`;
    case 'respondent.flagged_excluded':
      return `Excluded ${d(e, 'count')} flagged respondents`;
    case 'respondent.erased':
      return `${d(e, 'number') ? `Erased respondent #${d(e, 'number')}` : 'Erased an invitation'} on request (${d(e, 'answers')} answers deleted)${d(e, 'reason') ? `: ${d(e, 'reason')}` : ''}`;
    case 'run.started':
      return `Started run "${d(e, 'name')}" (${d(e, 'model')})`;
    case 'run.cancelled':
      return 'Cancelled a run';
    case 'export.personal_data':
      return `Downloaded ${d(e, 'file')} with personal data`;
    case 'audit.downloaded':
      return `Downloaded the audit trail (${d(e, 'rows')} events)`;
    default:
      return e.action;
  }
}
