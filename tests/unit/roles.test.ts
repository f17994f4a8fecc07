import { describe, expect, it } from 'vitest';
import { authorize } from '../../src/lib/server/guard';
import { can, CAPABILITIES, ROLES, type Role } from '../../src/lib/roles';
import { navFor } from '../../src/lib/navigation';

const member = (role: Role) => ({ id: `u-${role}`, email: `${role}@x.example`, displayName: role, role, active: true });
const locals = (role: Role | null): App.Locals => ({ user: role ? member(role) : null, sessionId: role ? 's' : null });

describe('role helper', () => {
  it('answers 401 before anything else when nobody is signed in', async () => {
    const result = authorize(locals(null), 'manageTeam');
    expect(result).toBeInstanceOf(Response);
    expect((result as Response).status).toBe(401);
    expect(await (result as Response).json()).toEqual({ error: 'Sign in first.' });
  });

  // The rights of DESIGN.md, "Users and roles".
  it.each<[Role, keyof typeof CAPABILITIES, boolean]>([
    ['admin', 'manageTeam', true],
    ['architect', 'manageTeam', false],
    ['engineer', 'manageTeam', false],
    ['sales', 'manageTeam', false],
    ['architect', 'editSpecs', true],
    ['engineer', 'editSpecs', false],
    ['sales', 'editSpecs', false],
    ['engineer', 'vote', true],
    ['sales', 'vote', false],
    ['sales', 'editParts', false],
    ['admin', 'editParts', true],
    ['sales', 'writeBriefs', true],
    ['engineer', 'writeBriefs', false],
    ['sales', 'readSpecs', true],
    // Issue 16: sales try values in Compare (never save, never sweep).
    ['sales', 'runComparisons', true],
    ['sales', 'runSweeps', false],
    ['engineer', 'runSweeps', true],
  ])('%s may %s: %s', (role, capability, allowed) => {
    expect(can(role, capability)).toBe(allowed);
    const result = authorize(locals(role), capability);
    if (allowed) expect(result).toMatchObject({ role });
    else expect((result as Response).status).toBe(403);
  });

  it('navigation: Team for admins only, Compare for every role, Sweep for all but sales', () => {
    for (const role of ROLES) {
      expect(navFor(role).some((item) => item.href === '/team')).toBe(role === 'admin');
      expect(navFor(role)[0]?.href).toBe('/specs');
      expect(navFor(role).some((item) => item.href === '/compare')).toBe(true);
      expect(navFor(role).some((item) => item.href === '/sweep')).toBe(role !== 'sales');
    }
  });
});
