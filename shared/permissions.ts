/**
 * Who may do what on a farm. Role checks are this table, nothing else: every farm route names
 * one permission, the authorization middleware looks the caller's role up here, and the client
 * asks the same table before it offers or fetches what the role may not have.
 * Lenders are read-only and, beyond that, see only scenarios shared with them (checked by the
 * scenario access rule, not here).
 */
import type { FarmRole } from './schema/accounts.js';

export const permissionTable = {
  'farm:read': ['owner', 'partner', 'consultant', 'lender'],
  'farm:update': ['owner', 'partner', 'consultant'],
  /** The herd and market baseline and milk records: farm data a lender is not shown. */
  'baseline:read': ['owner', 'partner', 'consultant'],
  'farm:delete': ['owner'],
  'members:read': ['owner', 'partner', 'consultant'],
  'members:manage': ['owner'],
  'scenario:read': ['owner', 'partner', 'consultant', 'lender'],
  'scenario:write': ['owner', 'partner', 'consultant'],
  'scenario:share': ['owner', 'consultant'],
  'scenario:decide': ['owner'],
  'preference:read': ['owner', 'partner', 'consultant'],
  'preference:write': ['owner', 'partner', 'consultant'],
  'review:write': ['lender'],
  'review:reply': ['owner', 'partner', 'consultant'],
  'audit:read': ['owner'],
  'document:read': ['owner', 'partner', 'consultant', 'lender'],
  'document:write': ['owner', 'partner', 'consultant'],
} as const satisfies Record<string, readonly FarmRole[]>;

export type Permission = keyof typeof permissionTable;

export function roleAllows(role: FarmRole, permission: Permission): boolean {
  return (permissionTable[permission] as readonly FarmRole[]).includes(role);
}
