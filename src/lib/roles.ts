/** Team roles of DESIGN.md; plain trade words, safe to import on both sides. */
export const ROLES = ['admin', 'architect', 'engineer', 'sales'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  architect: 'Architect',
  engineer: 'Engineer',
  sales: 'Sales',
};

export const ROLE_SUMMARIES: Record<Role, string> = {
  admin: 'Everything; manages team members, roles and the parts library.',
  architect: 'Creates and edits requirement sets, runs comparisons and sweeps, owns shortlists and decisions.',
  engineer: 'Runs comparisons, adds shortlist candidates, casts ballots and comments.',
  sales: 'Reads requirement sets and decided shortlists, tries values in Compare without saving, imports customer specs, writes and sends briefs.',
};

/** Named capabilities, so pages and endpoints ask "may this role do X" instead of listing roles. */
export const CAPABILITIES = {
  manageTeam: ['admin'],
  editSpecs: ['admin', 'architect'],
  readSpecs: ['admin', 'architect', 'engineer', 'sales'],
  /** Compare: open a set, try values without saving (sales quote feasibility from it), POST /evaluate. */
  runComparisons: ['admin', 'architect', 'engineer', 'sales'],
  /** Sweep a set's design space: engineering work, not a sales one. */
  runSweeps: ['admin', 'architect', 'engineer'],
  readParts: ['admin', 'architect', 'engineer', 'sales'],
  editParts: ['admin'],
  importSpecs: ['admin', 'architect', 'sales'],
  vote: ['admin', 'architect', 'engineer'],
  readBriefs: ['admin', 'architect', 'engineer', 'sales'],
  writeBriefs: ['admin', 'architect', 'sales'],
  readOutbox: ['admin'],
} as const satisfies Record<string, readonly Role[]>;
export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role, capability: Capability): boolean {
  return (CAPABILITIES[capability] as readonly Role[]).includes(role);
}
