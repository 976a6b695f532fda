import type { Role } from '../schemas/auth';

/**
 * Who may do what: the one table of roles. The server's route guard, the client's route `meta`,
 * its navigation and access composables, seat counting and the route × role tests all read it.
 * Paid seats are for admins, consultants and scientists; clients are free read-only guests who
 * see only the briefings shared with them (docs/design.md, "Who uses it").
 */
export const CAPABILITIES = {
  /** Catchments with their bands, datasets and scenarios, read only. */
  readCatchments: ['admin', 'consultant', 'scientist'],
  /** Create and change catchments, bands, datasets, uploads and scenarios. */
  editCatchments: ['admin', 'consultant'],
  /** Start, follow and cancel runs and read their results. */
  runScenarios: ['admin', 'consultant', 'scientist'],
  /** Surface response, reference models, skill, calibration and sweeps. */
  useLab: ['admin', 'consultant', 'scientist'],
  /** Published briefings: every one for the team, those shared with them for clients. */
  readBriefings: ['admin', 'consultant', 'client'],
  /** Draft, publish and share briefings. */
  writeBriefings: ['admin', 'consultant'],
  /** Members, roles and invitations. */
  manageMembers: ['admin'],
  /** Buy, resize and cancel the seat plan; invoices. */
  manageSeats: ['admin'],
  /** The job queue's page: waiting, running and failed work of the organisation, and failure messages. */
  watchQueue: ['admin'],
  /** Members who take one paid seat. */
  takeSeat: ['admin', 'consultant', 'scientist'],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof CAPABILITIES;
export const CAPABILITY_NAMES = Object.keys(CAPABILITIES) as Capability[];

/** What a route or page needs: a capability, or only to be signed in (any role). */
export type Access = Capability | 'signedIn';

/** The roles that have a capability. */
export function rolesWith(capability: Capability): readonly Role[] {
  return CAPABILITIES[capability];
}

/** Whether a role (null: signed out) has the access asked for. */
export function allows(role: Role | null | undefined, access: Access): boolean {
  if (!role) return false;
  return access === 'signedIn' || (CAPABILITIES[access] as readonly Role[]).includes(role);
}
