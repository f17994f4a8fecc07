import { can, type Capability, type Role } from './roles';

export interface NavItem {
  href: string;
  label: string;
  capability: Capability;
}

/** Screens that exist; a screen is listed here only once it works. */
export const NAV_ITEMS: NavItem[] = [
  { href: '/specs', label: 'Specs', capability: 'readSpecs' },
  { href: '/compare', label: 'Compare', capability: 'runComparisons' },
  { href: '/sweep', label: 'Sweep', capability: 'runSweeps' },
  { href: '/shortlists', label: 'Shortlists', capability: 'readSpecs' },
  { href: '/parts', label: 'Parts library', capability: 'readParts' },
  { href: '/briefs', label: 'Briefs', capability: 'readBriefs' },
  { href: '/team', label: 'Team', capability: 'manageTeam' },
  { href: '/outbox', label: 'Outbox', capability: 'readOutbox' },
];

export function navFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => can(role, item.capability));
}
