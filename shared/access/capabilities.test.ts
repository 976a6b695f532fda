import { describe, expect, it } from 'vitest';
import { ROLES } from '../schemas/auth';
import { allows, CAPABILITIES, CAPABILITY_NAMES, rolesWith } from './capabilities';

describe('capability table', () => {
  it('names only known roles, each at most once per capability', () => {
    for (const name of CAPABILITY_NAMES) {
      const roles = rolesWith(name);
      expect(roles.every((r) => (ROLES as readonly string[]).includes(r)), name).toBe(true);
      expect(new Set(roles).size, name).toBe(roles.length);
    }
  });

  it('keeps clients to reading briefings: no workshop, lab, team or seat capability', () => {
    const clientCan = CAPABILITY_NAMES.filter((c) => allows('client', c));
    expect(clientCan).toEqual(['readBriefings']);
  });

  it('lets scientists read catchments, run and use the lab, but not edit or write briefings', () => {
    expect(allows('scientist', 'readCatchments')).toBe(true);
    expect(allows('scientist', 'runScenarios')).toBe(true);
    expect(allows('scientist', 'useLab')).toBe(true);
    expect(allows('scientist', 'editCatchments')).toBe(false);
    expect(allows('scientist', 'readBriefings')).toBe(false);
  });

  it('gives every signed-in role "signedIn" and nothing to a signed-out visitor', () => {
    for (const role of ROLES) expect(allows(role, 'signedIn')).toBe(true);
    expect(allows(null, 'signedIn')).toBe(false);
    expect(allows(undefined, 'readBriefings')).toBe(false);
  });

  it('only admins manage members and seats; writers of catchments and briefings are also readers', () => {
    expect(CAPABILITIES.manageMembers).toEqual(['admin']);
    expect(CAPABILITIES.manageSeats).toEqual(['admin']);
    for (const role of rolesWith('editCatchments')) expect(allows(role, 'readCatchments')).toBe(true);
    for (const role of rolesWith('writeBriefings')) expect(allows(role, 'readBriefings')).toBe(true);
  });
});
