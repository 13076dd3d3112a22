/**
 * Who may do what (the roles described in README.md). The server enforces this table on every route;
 * the client reads the same table only to hide controls a role cannot use.
 */
import { z } from 'zod';

export const roles = ['owner', 'editor', 'analyst', 'viewer'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

const all: readonly Role[] = roles;

export const permissions = {
  /** See the team, its members and its studies list. */
  'team:read': all,
  /** Invite, change roles, remove members; billing. */
  'team:manage': ['owner'],
  'study:read': all,
  /** Create and edit studies, attributes, designs, questionnaire. */
  'study:write': ['owner', 'editor'],
  /** Go live, close, reopen, links, invitations, quotas. */
  'fieldwork:manage': ['owner', 'editor'],
  /** Aggregate fieldwork figures and respondent-level answers without personal data. */
  'responses:read': all,
  /** Personal data: e-mail addresses, external ids, free-text answers. */
  'personal:read': ['owner', 'editor', 'analyst'],
  /** Include/exclude respondents, quality thresholds. */
  'responses:manage': ['owner', 'editor', 'analyst'],
  'runs:read': all,
  /** Start and cancel estimation runs, save respondent filters. */
  'runs:manage': ['owner', 'analyst'],
  /** Save, rename and delete what-if share scenarios (everyone may read them). */
  'scenarios:write': ['owner', 'editor', 'analyst'],
  /** Downloads; personal columns still need personal:read. */
  'exports:read': all,
  /** Read and download the team's audit trail. */
  'audit:read': ['owner'],
  /** Erase one respondent's data on request (data-protection right to erasure). */
  'respondents:erase': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

export function roleCan(role: Role, permission: Permission): boolean {
  return (permissions[permission] as readonly Role[]).includes(role);
}

export const roleDescriptions: Record<Role, string> = {
  owner: 'Everything, including team membership and billing',
  editor: 'Builds studies, runs fieldwork and invites respondents',
  analyst: 'Reads studies and responses, runs models, downloads data and estimates',
  viewer: 'Reads studies and results; no personal data',
};
